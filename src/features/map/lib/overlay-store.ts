// A scanned plan or aerial photo laid over the map is kept in this browser only
// (IndexedDB): it is never uploaded, and nobody else sees it.
export type StoredOverlay = {
  name: string;
  image: Blob;
  /** [[south, west], [north, east]] */
  bounds: [[number, number], [number, number]];
  opacity: number;
};

const DB_NAME = 'heelwood-map';
const STORE = 'overlays';
const KEY = 'own-overlay';

function open(): Promise<IDBDatabase> {
  return new Promise((resolve, reject) => {
    if (typeof indexedDB === 'undefined') {
      reject(new Error('This browser cannot keep images for the map (no IndexedDB).'));
      return;
    }
    const req = indexedDB.open(DB_NAME, 1);
    req.onupgradeneeded = () => req.result.createObjectStore(STORE);
    req.onsuccess = () => resolve(req.result);
    req.onerror = () => reject(req.error ?? new Error('The browser refused to open its storage.'));
  });
}

async function run<T>(mode: IDBTransactionMode, fn: (store: IDBObjectStore) => IDBRequest<T>): Promise<T> {
  const db = await open();
  try {
    return await new Promise<T>((resolve, reject) => {
      const tx = db.transaction(STORE, mode);
      const req = fn(tx.objectStore(STORE));
      tx.oncomplete = () => resolve(req.result);
      tx.onerror = () => reject(tx.error ?? new Error('The browser could not store the image.'));
      tx.onabort = () => reject(tx.error ?? new Error('The browser could not store the image (storage full?).'));
    });
  } finally {
    db.close();
  }
}

export async function loadOverlay(): Promise<StoredOverlay | null> {
  const v = await run<StoredOverlay | undefined>('readonly', (s) => s.get(KEY) as IDBRequest<StoredOverlay | undefined>);
  return v ?? null;
}

export async function saveOverlay(o: StoredOverlay): Promise<void> {
  await run('readwrite', (s) => s.put(o, KEY));
}

export async function removeOverlay(): Promise<void> {
  await run('readwrite', (s) => s.delete(KEY));
}
