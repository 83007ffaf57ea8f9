"use client";

import { keepPreviousData, useQuery } from "@tanstack/react-query";
import { useEffect, useState } from "react";
import type { MassResponse } from "@/lib/commands/mass";
import type { Loading, PlannedItem } from "./model";

/** The query string of a loading, as the mass and statement routes read it. */
export function loadingQuery(loading: Loading, includePlanned: boolean): string {
  const params = new URLSearchParams();
  params.set("occupants", String(loading.occupants));
  if (loading.fuelL > 0) params.set("fuelL", String(loading.fuelL));
  if (loading.waterL > 0) params.set("waterL", String(loading.waterL));
  if (loading.cargoKg > 0) params.set("cargoKg", String(loading.cargoKg));
  if (loading.trailerAtmKg > 0) {
    params.set("trailerAtmKg", String(loading.trailerAtmKg));
    params.set("towballKg", String(loading.towballKg));
  }
  if (includePlanned) params.set("includePlanned", "1");
  return params.toString();
}

/**
 * The figures of record from the server for this loading and plan. The browser computes the
 * same figures at once; these confirm them (and win when they differ).
 */
export function useServerFigures(vehicleId: string, loading: Loading, planned: PlannedItem[], enabled: boolean) {
  const query = loadingQuery(loading, true);
  const planKey = planned.map((p) => `${p.id}:${p.massKg}:${p.xMm}:${p.zone}:${p.massKind}`).join("|");
  return useQuery({
    queryKey: ["vehicle-mass", vehicleId, query, planKey],
    enabled,
    placeholderData: keepPreviousData,
    staleTime: 30_000,
    queryFn: async ({ signal }): Promise<{ key: string; figures: MassResponse }> => {
      const response = await fetch(`/api/vehicles/${vehicleId}/mass?${query}`, { signal, headers: { accept: "application/json" } });
      if (!response.ok) throw new Error(`The server could not check the figures (${response.status})`);
      return { key: `${query}#${planKey}`, figures: (await response.json()) as MassResponse };
    },
  });
}

/** The value once it has stopped changing for `ms` (the same object, so callers can compare). */
export function useSettled<T>(value: T, ms: number): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setSettled(value), ms);
    return () => clearTimeout(timer);
  }, [value, ms]);
  return settled;
}
