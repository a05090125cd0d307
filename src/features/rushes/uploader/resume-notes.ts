/**
 * Which upload a file belongs to, kept in this browser per channel and file (name, size, last change),
 * so choosing the same file after a reload carries on with the parts Kerf recorded. Only ids: the
 * parts themselves are always read back from Kerf.
 */
export interface ResumeNote {
  uploadId: string;
  key: string;
}

const keyOf = (channelId: string, fingerprint: string) => `kerf:upload:${channelId}:${fingerprint}`;

function store(): Storage | null {
  try {
    return window.localStorage;
  } catch {
    return null;
  }
}

export function readResumeNote(channelId: string, fingerprint: string): ResumeNote | null {
  try {
    const raw = store()?.getItem(keyOf(channelId, fingerprint));
    if (!raw) return null;
    const note = JSON.parse(raw) as Partial<ResumeNote>;
    return typeof note.uploadId === "string" && typeof note.key === "string" ? { uploadId: note.uploadId, key: note.key } : null;
  } catch {
    return null;
  }
}

export function writeResumeNote(channelId: string, fingerprint: string, note: ResumeNote) {
  try {
    store()?.setItem(keyOf(channelId, fingerprint), JSON.stringify(note));
  } catch {
    // A full or refused storage only means no resuming after a reload; the upload itself goes on.
  }
}

export function forgetResumeNote(channelId: string, fingerprint: string) {
  try {
    store()?.removeItem(keyOf(channelId, fingerprint));
  } catch {
    // Nothing to forget then.
  }
}
