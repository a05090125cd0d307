/** The words of the rushes feature, shared by the tables, the API and the pages. */
export const shotKinds = ["talking_head", "build_closeup", "test_run", "slow_motion", "aerial", "insert", "pickup"] as const;
export type ShotKind = (typeof shotKinds)[number];
export const shotKindLabels: Record<ShotKind, string> = {
  talking_head: "Talking head",
  build_closeup: "Build close-up",
  test_run: "Test run",
  slow_motion: "Slow motion",
  aerial: "Aerial",
  insert: "Insert",
  pickup: "Pickup",
};

export const shotPriorities = ["must", "normal", "spare"] as const;
export type ShotPriority = (typeof shotPriorities)[number];
export const shotPriorityLabels: Record<ShotPriority, string> = {
  must: "Must have",
  normal: "Normal",
  spare: "If time allows",
};

export const shotStatuses = ["planned", "captured", "dropped"] as const;
export type ShotStatus = (typeof shotStatuses)[number];
export const shotStatusLabels: Record<ShotStatus, string> = { planned: "Planned", captured: "Captured", dropped: "Dropped" };

export const clipRatings = ["select", "maybe", "reject"] as const;
export type ClipRating = (typeof clipRatings)[number];
export const clipRatingLabels: Record<ClipRating, string> = { select: "Select", maybe: "Maybe", reject: "Reject" };

export const uploadStatuses = ["uploading", "completed", "cancelled", "abandoned", "refused"] as const;
export type UploadStatus = (typeof uploadStatuses)[number];

/**
 * Where the server is with a clip's own poster, proxy and probe: waiting for the queue, making them,
 * ready, or failed (with a reason in plain words, and a retry).
 */
export const clipMediaStates = ["waiting", "making", "ready", "failed"] as const;
export type ClipMediaState = (typeof clipMediaStates)[number];
