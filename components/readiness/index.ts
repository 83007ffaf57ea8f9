export { READINESS_LABELS, READINESS_TONES, ReadinessPill } from "./readiness-pill";
export { READINESS_CAUTION, ReadinessPanel, VehicleReadinessPanel, type ReadinessPanelProps } from "./readiness-panel";
