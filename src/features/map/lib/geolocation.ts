// The phone's position, with the refusals explained in plain words.
export type Fix = { lat: number; lon: number; accuracyM: number };

export function geolocationMessage(err: GeolocationPositionError | Error): string {
  if ('code' in err) {
    if (err.code === 1) {
      return 'Your browser did not share your position. You can allow it in the browser’s settings for this site, or use the map instead.';
    }
    if (err.code === 3) return 'Finding your position took too long. Try again in the open, or use the map instead.';
    return 'Your position could not be found just now. Try again, or use the map instead.';
  }
  return err.message;
}

export function currentPosition(): Promise<Fix> {
  return new Promise((resolve, reject) => {
    if (typeof navigator === 'undefined' || !navigator.geolocation) {
      reject(new Error('This browser cannot tell your position. Use the map instead.'));
      return;
    }
    navigator.geolocation.getCurrentPosition(
      (p) => resolve({ lat: p.coords.latitude, lon: p.coords.longitude, accuracyM: p.coords.accuracy }),
      (e) => reject(e),
      { enableHighAccuracy: true, timeout: 20_000, maximumAge: 30_000 },
    );
  });
}
