/**
 * A poster frame from the chosen file itself: the browser decodes it in a hidden <video>, draws one
 * frame to a canvas, and the JPEG streams through Kerf's server into storage. Files the browser can't
 * decode (many camera codecs) simply get no poster: the server makes one from the stored file.
 */
export async function posterFrom(file: File): Promise<Blob | null> {
  const url = URL.createObjectURL(file);
  const video = document.createElement("video");
  video.muted = true;
  video.preload = "auto";
  video.src = url;
  try {
    await within(new Promise<void>((resolve, reject) => {
      video.onloadeddata = () => resolve();
      video.onerror = () => reject(new Error("not decodable"));
    }), 8_000);
    const at = Math.min(1, (video.duration || 0) / 2);
    if (at > 0) {
      await within(new Promise<void>((resolve) => {
        video.onseeked = () => resolve();
        video.currentTime = at;
      }), 8_000);
    }
    // A file whose picture the browser can't decode (HEVC, ProRes, DNxHR in Chromium) still fires
    // loadeddata when its sound plays, with no picture size: a capture then would be a black frame.
    if (video.videoWidth === 0 || video.videoHeight === 0) return null;
    const width = 480;
    const height = Math.round((width * video.videoHeight) / video.videoWidth);
    const canvas = document.createElement("canvas");
    canvas.width = width;
    canvas.height = height;
    canvas.getContext("2d")!.drawImage(video, 0, 0, width, height);
    return await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, "image/jpeg", 0.8));
  } catch {
    return null;
  } finally {
    URL.revokeObjectURL(url);
  }
}

function within<T>(work: Promise<T>, ms: number): Promise<T> {
  return Promise.race([work, new Promise<T>((_, reject) => setTimeout(() => reject(new Error("timed out")), ms))]);
}
