// POST a multipart form with XMLHttpRequest, because only XHR reports upload progress (fetch has no upload
// progress events). The body is answered as JSON; a network failure rejects.

export type UploadProgress = { loaded: number; total: number };
export type UploadAnswer = { status: number; body: unknown };

export function postFormWithProgress(url: string, form: FormData, onProgress: (p: UploadProgress) => void): { done: Promise<UploadAnswer>; abort: () => void } {
  const xhr = new XMLHttpRequest();
  const done = new Promise<UploadAnswer>((resolve, reject) => {
    xhr.open('POST', url);
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.withCredentials = true;
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress({ loaded: event.loaded, total: event.total });
    };
    xhr.onload = () => {
      let body: unknown = null;
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        body = null;
      }
      resolve({ status: xhr.status, body });
    };
    xhr.onerror = () => reject(new Error('The upload was interrupted (network error). Check the connection and try again.'));
    xhr.onabort = () => reject(new Error('The upload was cancelled.'));
    xhr.send(form);
  });
  return { done, abort: () => xhr.abort() };
}
