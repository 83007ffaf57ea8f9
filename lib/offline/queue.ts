/**
 * The phone's outbox: reports made without signal wait here (IndexedDB, so they survive the
 * browser closing) until they are sent. Each carries the device id the server de-duplicates on,
 * so sending one twice never makes two. Browser only.
 */
import { retryDelayMs, type SendOutcome } from "./retry";

export type QueuedFile = { field: string; blob: Blob; name: string };

export type QueuedReport = {
  /** The report's device id (its `clientId`), also the queue key. */
  id: string;
  kind: "defect" | "check";
  /** Who made it: only their session sends it. */
  userId: string;
  url: string;
  /** Text fields of the form, sent as multipart fields. */
  fields: Record<string, string>;
  files: QueuedFile[];
  /** A line for the list: "Defect on MH-003: Brakes". */
  label: string;
  createdAt: number;
  attempts: number;
  nextAttemptAt: number;
  status: "waiting" | "refused" | "signed_out";
  lastError: string | null;
};

const DB_NAME = "rigline-offline";
const STORE = "outbox";
const CHANNEL = "rigline-outbox";

function openDb(): Promise<IDBDatabase> {
  return new Promise((resolve, reject) => {
    const request = indexedDB.open(DB_NAME, 1);
    request.onupgradeneeded = () => {
      if (!request.result.objectStoreNames.contains(STORE)) request.result.createObjectStore(STORE, { keyPath: "id" });
    };
    request.onsuccess = () => resolve(request.result);
    request.onerror = () => reject(request.error ?? new Error("IndexedDB is not available"));
  });
}

async function withStore<T>(mode: IDBTransactionMode, work: (store: IDBObjectStore) => IDBRequest<T> | void): Promise<T | undefined> {
  const db = await openDb();
  try {
    return await new Promise<T | undefined>((resolve, reject) => {
      const tx = db.transaction(STORE, mode);
      const request = work(tx.objectStore(STORE));
      let result: T | undefined;
      if (request) request.onsuccess = () => (result = request.result);
      tx.oncomplete = () => resolve(result);
      tx.onerror = () => reject(tx.error ?? new Error("The phone's storage refused the change"));
      tx.onabort = () => reject(tx.error ?? new Error("The phone's storage refused the change"));
    });
  } finally {
    db.close();
  }
}

/** Tells every open page (and this one) that the queue changed. */
export function announceChange(): void {
  if (typeof BroadcastChannel !== "undefined") {
    const channel = new BroadcastChannel(CHANNEL);
    channel.postMessage("changed");
    channel.close();
  }
  window.dispatchEvent(new Event(CHANNEL));
}

/** Calls `listener` whenever the queue changes, in this page or another; returns the unsubscribe. */
export function onQueueChange(listener: () => void): () => void {
  window.addEventListener(CHANNEL, listener);
  const channel = typeof BroadcastChannel !== "undefined" ? new BroadcastChannel(CHANNEL) : null;
  if (channel) channel.onmessage = listener;
  return () => {
    window.removeEventListener(CHANNEL, listener);
    channel?.close();
  };
}

export async function enqueue(report: Omit<QueuedReport, "attempts" | "nextAttemptAt" | "status" | "lastError" | "createdAt"> & { createdAt?: number }): Promise<void> {
  const item: QueuedReport = { ...report, createdAt: report.createdAt ?? Date.now(), attempts: 0, nextAttemptAt: 0, status: "waiting", lastError: null };
  await withStore("readwrite", (store) => store.put(item));
  announceChange();
}

export async function listQueued(): Promise<QueuedReport[]> {
  const all = (await withStore<QueuedReport[]>("readonly", (store) => store.getAll() as IDBRequest<QueuedReport[]>)) ?? [];
  return all.sort((a, b) => a.createdAt - b.createdAt);
}

export async function removeQueued(id: string): Promise<void> {
  await withStore("readwrite", (store) => store.delete(id));
  announceChange();
}

/** Records what one attempt came to: removed when sent, else kept with its reason and next time. */
export async function recordAttempt(item: QueuedReport, outcome: SendOutcome, nowMs: number): Promise<void> {
  if (outcome.kind === "sent") {
    await removeQueued(item.id);
    return;
  }
  const attempts = item.attempts + 1;
  const next: QueuedReport =
    outcome.kind === "retry"
      ? { ...item, attempts, status: "waiting", lastError: outcome.reason, nextAttemptAt: nowMs + retryDelayMs(attempts) }
      : outcome.kind === "signed_out"
        ? { ...item, attempts, status: "signed_out", lastError: "Sign in again to send it", nextAttemptAt: nowMs }
        : { ...item, attempts, status: "refused", lastError: outcome.reason, nextAttemptAt: Number.MAX_SAFE_INTEGER };
  await withStore("readwrite", (store) => store.put(next));
  announceChange();
}

/** Marks signed-out items of this user as waiting again (they signed back in). */
export async function wakeSignedOut(userId: string): Promise<void> {
  const items = await listQueued();
  const stale = items.filter((i) => i.userId === userId && i.status === "signed_out");
  if (stale.length === 0) return;
  await withStore("readwrite", (store) => {
    for (const i of stale) store.put({ ...i, status: "waiting", nextAttemptAt: 0 });
  });
  announceChange();
}
