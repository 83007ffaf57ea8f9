export { newClientId } from "./client-id";
export { QUEUE_PHOTO_MAX_SIDE_PX, shrinkPhoto } from "./images";
export { announceChange, enqueue, listQueued, onQueueChange, recordAttempt, removeQueued, wakeSignedOut } from "./queue";
export type { QueuedFile, QueuedReport } from "./queue";
export { FIRST_RETRY_MS, MAX_RETRY_MS, classifyAttempt, isDue, retryDelayMs } from "./retry";
export type { SendOutcome } from "./retry";
export { flushQueue, sendQueued } from "./send";
export type { SendReply } from "./send";
