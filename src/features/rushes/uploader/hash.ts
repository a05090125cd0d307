/** The file's SHA-256, computed in a worker; null when the browser can't (the upload goes on without it). */
export function sha256Of(file: File): Promise<string | null> {
  return new Promise((resolve) => {
    let worker: Worker;
    try {
      worker = new Worker(new URL("./hash-worker.ts", import.meta.url), { type: "module" });
    } catch {
      return resolve(null);
    }
    worker.onmessage = (event: MessageEvent<{ sha256?: string; error?: string }>) => {
      worker.terminate();
      resolve(event.data.sha256 ?? null);
    };
    worker.onerror = () => {
      worker.terminate();
      resolve(null);
    };
    worker.postMessage(file);
  });
}
