// fetch cannot report upload progress; XMLHttpRequest can. Photos (up to 10 MB) and CSV
// files (up to 5 MB) go through here so a slow phone connection shows how far along it is.
// Errors become the same ApiError the rest of the app uses.
import { ApiError, toApiError } from '../../../lib/api-client';

export type Progress = { phase: 'uploading'; fraction: number } | { phase: 'processing' };

export type SendOptions = {
  method?: 'POST' | 'PUT';
  body: XMLHttpRequestBodyInit;
  headers?: Record<string, string>;
  onProgress?: (progress: Progress) => void;
  signal?: AbortSignal;
};

export type RawResponse = { status: number; text: string };

export function sendWithProgress(url: string, { method = 'POST', body, headers = {}, onProgress, signal }: SendOptions): Promise<RawResponse> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open(method, url);
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    for (const [name, value] of Object.entries(headers)) xhr.setRequestHeader(name, value);
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable && event.total > 0) onProgress?.({ phase: 'uploading', fraction: event.loaded / event.total });
    };
    // Everything is sent; the server is now reading and checking it.
    xhr.upload.onload = () => onProgress?.({ phase: 'processing' });
    xhr.onload = () => resolve({ status: xhr.status, text: xhr.responseText });
    xhr.onerror = () => reject(new ApiError(0, 'NETWORK', 'Heelwood could not reach its server. Check your connection and try again.'));
    xhr.onabort = () => reject(new DOMException('The upload was stopped.', 'AbortError'));
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    xhr.send(body);
  });
}

/** JSON on success; an ApiError (with the server's message and fields) otherwise. */
export async function jsonOrThrow<T>(response: RawResponse): Promise<T> {
  if (response.status >= 200 && response.status < 300) return (response.text ? JSON.parse(response.text) : undefined) as T;
  throw await toApiError(new Response(response.text, { status: response.status }));
}
