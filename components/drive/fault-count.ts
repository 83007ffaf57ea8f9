/** "no faults", "1 fault", "3 faults": a check's findings in words. */
export function faultCount(faults: number): string {
  return faults === 0 ? "no faults" : faults === 1 ? "1 fault" : `${faults} faults`;
}
