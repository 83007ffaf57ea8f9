import { StatusPill } from "@/components/ui";
import type { VehicleState } from "@/db/schema";

export const VEHICLE_STATE_LABELS: Record<VehicleState, string> = {
  in_service: "In service",
  in_fitout: "In fit-out",
  grounded: "Grounded",
  retired: "Retired",
};

const tone = { in_service: "ok", in_fitout: "info", grounded: "danger", retired: "neutral" } as const;

export function VehicleStatePill({ state, size }: { state: VehicleState; size?: "sm" | "md" | "lg" }) {
  return <StatusPill tone={tone[state]} size={size}>{VEHICLE_STATE_LABELS[state]}</StatusPill>;
}
