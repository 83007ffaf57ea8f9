"use client";

import { useCallback, useEffect, useState, useSyncExternalStore } from "react";
import { listQueued, onQueueChange, type QueuedReport } from "@/lib/offline";

/** The phone's queued reports of this user, kept current as the queue changes. */
export function useOutbox(userId: string) {
  const [items, setItems] = useState<QueuedReport[] | null>(null);
  const refresh = useCallback(async () => {
    try {
      setItems((await listQueued()).filter((i) => i.userId === userId));
    } catch {
      setItems([]);
    }
  }, [userId]);
  useEffect(() => {
    // Read once now, then whenever this page or another changes the queue.
    const first = setTimeout(() => void refresh(), 0);
    const off = onQueueChange(() => void refresh());
    return () => {
      clearTimeout(first);
      off();
    };
  }, [refresh]);
  return { items, refresh };
}

function subscribeOnline(callback: () => void) {
  window.addEventListener("online", callback);
  window.addEventListener("offline", callback);
  return () => {
    window.removeEventListener("online", callback);
    window.removeEventListener("offline", callback);
  };
}

/** Whether the browser thinks it has a network (true while rendering on the server). */
export function useOnline(): boolean {
  return useSyncExternalStore(
    subscribeOnline,
    () => navigator.onLine,
    () => true,
  );
}
