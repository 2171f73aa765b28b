/** PUT a file straight to storage, reporting progress; fetch() cannot report upload progress. */
export function putWithProgress(url: string, file: File, contentType: string, onProgress: (fraction: number) => void): Promise<void> {
  return new Promise((resolve, reject) => {
    const request = new XMLHttpRequest();
    request.open("PUT", url);
    request.setRequestHeader("content-type", contentType);
    request.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress(event.loaded / event.total);
    };
    request.onload = () => (request.status >= 200 && request.status < 300 ? resolve() : reject(new Error(`storage answered ${request.status}`)));
    request.onerror = () => reject(new Error("the connection to storage failed"));
    request.send(file);
  });
}
