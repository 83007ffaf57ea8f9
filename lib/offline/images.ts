/**
 * Makes a phone photo smaller before it waits in the queue: at most 1600 px on its longest side,
 * JPEG. Drawing it on a canvas also leaves the camera's metadata (GPS position among it)
 * behind on the phone. Falls back to the original file when the browser cannot do it.
 */
export const QUEUE_PHOTO_MAX_SIDE_PX = 1600;

export async function shrinkPhoto(file: File): Promise<File> {
  if (typeof createImageBitmap !== "function" || typeof document === "undefined") return file;
  try {
    const bitmap = await createImageBitmap(file, { imageOrientation: "from-image" });
    const scale = Math.min(1, QUEUE_PHOTO_MAX_SIDE_PX / Math.max(bitmap.width, bitmap.height));
    const width = Math.max(1, Math.round(bitmap.width * scale));
    const height = Math.max(1, Math.round(bitmap.height * scale));
    const canvas = document.createElement("canvas");
    canvas.width = width;
    canvas.height = height;
    const context = canvas.getContext("2d");
    if (!context) return file;
    context.drawImage(bitmap, 0, 0, width, height);
    bitmap.close();
    const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, "image/jpeg", 0.85));
    if (!blob || blob.size === 0) return file;
    const base = file.name.replace(/\.[A-Za-z0-9]{1,5}$/, "") || "photo";
    return new File([blob], `${base}.jpg`, { type: "image/jpeg", lastModified: file.lastModified });
  } catch {
    return file;
  }
}
