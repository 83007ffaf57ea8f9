"use client";

import { useEffect, useState } from "react";
import { Button, StatusShape, cn } from "@/components/ui";
import { flushQueue, removeQueued } from "@/lib/offline";
import { useOnline, useOutbox } from "./use-outbox";

const RETRY_EVERY_MS = 15_000;

/**
 * On every driver page: registers the service worker, asks it to keep the driver's pages for
 * use without signal, sends queued reports when the network returns (and every 15 s while any
 * wait), and shows what is waiting.
 */
export function OfflineSupport({ userId, warmUrls }: { userId: string; warmUrls: string[] }) {
  const online = useOnline();
  const { items } = useOutbox(userId);
  const [savedAt, setSavedAt] = useState<string | null>(null);
  const [sentNote, setSentNote] = useState<string | null>(null);
  const [sending, setSending] = useState(false);
  const warmKey = warmUrls.join("|");

  // Service worker: register, then (when online) keep the driver's pages.
  useEffect(() => {
    if (!("serviceWorker" in navigator)) return;
    const stored = localStorage.getItem(`rigline-offline-saved:${userId}`);
    const showStored = setTimeout(() => setSavedAt(stored), 0);
    let cancelled = false;
    const onMessage = (event: MessageEvent) => {
      const data = event.data as { type?: string } | null;
      if (data?.type === "warmed" && !cancelled) {
        // The phone's own clock: when this phone last kept the pages for offline use, in the driver's time.
        const at = new Date().toLocaleTimeString("en-AU", { hour: "2-digit", minute: "2-digit", hour12: false });
        localStorage.setItem(`rigline-offline-saved:${userId}`, at);
        setSavedAt(at);
      }
    };
    navigator.serviceWorker.addEventListener("message", onMessage);
    void (async () => {
      try {
        await navigator.serviceWorker.register("/sw.js", { scope: "/" });
        const registration = await navigator.serviceWorker.ready;
        if (cancelled || !navigator.onLine) return;
        const assets = new Set<string>();
        for (const entry of performance.getEntriesByType("resource")) if (entry.name.includes("/_next/static/")) assets.add(entry.name);
        document.querySelectorAll<HTMLScriptElement>("script[src]").forEach((s) => assets.add(s.src));
        document.querySelectorAll<HTMLLinkElement>("link[rel=stylesheet], link[rel=preload]").forEach((l) => l.href && assets.add(l.href));
        registration.active?.postMessage({ type: "warm", urls: warmKey.split("|").filter(Boolean), userId, assets: [...assets] });
      } catch {
        // No service worker (private window, old browser): the pages still work online.
      }
    })();
    return () => {
      cancelled = true;
      clearTimeout(showStored);
      navigator.serviceWorker.removeEventListener("message", onMessage);
    };
  }, [userId, warmKey]);

  // Send what waits: now, when the network returns, and on a timer.
  useEffect(() => {
    let stopped = false;
    const send = async (force = false) => {
      if (!navigator.onLine) return;
      const replies = await flushQueue(userId, { force });
      const sent = [...replies.values()].filter((r) => r.outcome.kind === "sent").length;
      if (sent > 0 && !stopped) setSentNote(sent === 1 ? "Sent 1 report" : `Sent ${sent} reports`);
    };
    const onOnline = () => void send(true);
    window.addEventListener("online", onOnline);
    const first = setTimeout(() => void send(true), 500);
    const timer = setInterval(() => void send(false), RETRY_EVERY_MS);
    return () => {
      stopped = true;
      window.removeEventListener("online", onOnline);
      clearTimeout(first);
      clearInterval(timer);
    };
  }, [userId]);

  const waiting = (items ?? []).filter((i) => i.status !== "refused");
  const refused = (items ?? []).filter((i) => i.status === "refused");

  const sendNow = async () => {
    setSending(true);
    try {
      const replies = await flushQueue(userId, { force: true });
      const sent = [...replies.values()].filter((r) => r.outcome.kind === "sent").length;
      if (sent > 0) setSentNote(sent === 1 ? "Sent 1 report" : `Sent ${sent} reports`);
    } finally {
      setSending(false);
    }
  };

  return (
    <section aria-label="Signal and sending" className="flex flex-col gap-2" data-testid="offline-support">
      <div className={cn("flex flex-wrap items-center gap-x-4 gap-y-2 rounded-lg border-2 px-4 py-3 text-base", online ? "border-line bg-surface-raised" : "border-warn bg-warn-soft text-warn-ink")}>
        <span className="flex items-center gap-2 font-semibold" data-testid="signal-state">
          <StatusShape tone={online ? "ok" : "warn"} sizePx={16} />
          {online ? "Signal" : "No signal — showing pages saved on this phone"}
        </span>
        <span role="status" aria-live="polite" className="font-semibold" data-testid="waiting-count">
          {waiting.length > 0 ? `Waiting to send: ${waiting.length}` : sentNote ? `${sentNote}. Nothing waiting.` : "Nothing waiting to send"}
        </span>
        {savedAt && <span className="text-sm text-muted" data-testid="offline-ready">Works without signal (saved {savedAt})</span>}
        {waiting.length > 0 && online && (
          <Button size="lg" variant="secondary" onClick={() => void sendNow()} loading={sending}>
            Send now
          </Button>
        )}
      </div>
      {waiting.length > 0 && (
        <ul className="flex flex-col gap-1 text-base" aria-label="Waiting to send">
          {waiting.map((i) => (
            <li key={i.id} className="flex items-start gap-2">
              <StatusShape tone="warn" sizePx={14} className="mt-1.5" />
              <span>
                {i.label}
                {i.lastError && <span className="block text-sm text-muted">{i.lastError}</span>}
              </span>
            </li>
          ))}
        </ul>
      )}
      {refused.length > 0 && (
        <ul className="flex flex-col gap-2" aria-label="Not sent">
          {refused.map((i) => (
            <li key={i.id} className="flex flex-wrap items-center gap-3 rounded-lg border-2 border-danger bg-danger-soft px-4 py-3 text-danger-ink">
              <StatusShape tone="danger" sizePx={16} />
              <span className="flex-1">
                <span className="block font-semibold">Not sent: {i.label}</span>
                <span className="block">{i.lastError}</span>
              </span>
              <Button size="lg" variant="secondary" onClick={() => void removeQueued(i.id)}>
                Remove
              </Button>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
