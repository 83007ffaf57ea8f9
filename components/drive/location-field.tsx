"use client";

import { useState } from "react";
import { Button } from "@/components/ui";

export type Position = { latitude: number; longitude: number };

/**
 * Adds the phone's position to a report, only when the driver asks for it. GPS works without
 * signal; a refusal or a timeout leaves the report without a location.
 */
export function LocationField({ value, onChange }: { value: Position | null; onChange: (p: Position | null) => void }) {
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);

  const locate = () => {
    if (!("geolocation" in navigator)) {
      setProblem("This phone cannot give a location.");
      return;
    }
    setBusy(true);
    setProblem(null);
    navigator.geolocation.getCurrentPosition(
      (pos) => {
        setBusy(false);
        onChange({ latitude: Number(pos.coords.latitude.toFixed(6)), longitude: Number(pos.coords.longitude.toFixed(6)) });
      },
      (error) => {
        setBusy(false);
        setProblem(error.code === error.PERMISSION_DENIED ? "Location is not allowed on this phone. The report goes without it." : "No position found. Try again in the open, or send without it.");
      },
      { enableHighAccuracy: true, timeout: 20_000, maximumAge: 60_000 },
    );
  };

  return (
    <div className="flex flex-col gap-2" role="group" aria-label="Location">
      <span className="text-sm font-semibold">Location (optional)</span>
      {value ? (
        <div className="flex flex-wrap items-center gap-3">
          <span className="font-medium tabular-nums" data-testid="location-value">
            {value.latitude.toFixed(5)}, {value.longitude.toFixed(5)}
          </span>
          <Button type="button" size="lg" variant="ghost" onClick={() => onChange(null)}>
            Remove location
          </Button>
        </div>
      ) : (
        <Button type="button" size="lg" variant="secondary" onClick={locate} loading={busy} className="self-start">
          Add my location
        </Button>
      )}
      {problem && <p className="text-sm font-semibold text-warn-ink">{problem}</p>}
    </div>
  );
}
