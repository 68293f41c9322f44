const deg = new Intl.NumberFormat('en-GB', { minimumFractionDigits: 5, maximumFractionDigits: 5 });

/** "52.08550° N, 2.63850° W" */
export function formatLatLon(lat: number, lon: number): string {
  return `${deg.format(Math.abs(lat))}° ${lat >= 0 ? 'N' : 'S'}, ${deg.format(Math.abs(lon))}° ${lon >= 0 ? 'E' : 'W'}`;
}

/** Leaflet writes attribution as HTML; the tile source's credit is plain text. */
export function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

/** Seven decimals of a degree is about a centimetre: plenty for a bush. */
export function roundCoord(v: number): number {
  return Math.round(v * 1e7) / 1e7;
}
