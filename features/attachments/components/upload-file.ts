// Sends one file as the raw request body with XMLHttpRequest, because fetch() still reports no
// upload progress in browsers. Resolves with the server's JSON (an AttachmentDto or an error).
export interface UploadOutcome {
  ok: boolean;
  status: number;
  message?: string;
}

export function uploadFile(
  url: string,
  file: File,
  onProgress: (fraction: number) => void,
): Promise<UploadOutcome> {
  return new Promise((resolve) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", url);
    xhr.setRequestHeader("x-file-name", encodeURIComponent(file.name));
    xhr.setRequestHeader("content-type", "application/octet-stream");
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress(e.loaded / e.total);
    };
    xhr.onload = () => {
      let message: string | undefined;
      try {
        message = JSON.parse(xhr.responseText)?.error?.message;
      } catch {
        message = undefined;
      }
      resolve({ ok: xhr.status >= 200 && xhr.status < 300, status: xhr.status, message });
    };
    xhr.onerror = () =>
      resolve({
        ok: false,
        status: 0,
        message: "The upload was interrupted; check the connection and try again.",
      });
    xhr.send(file);
  });
}
