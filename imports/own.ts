/**
 * Records keyed by a spreadsheet's own header text. A header can be any string, "__proto__"
 * included, so keys are written as own properties and read only when they are own.
 */
export function putOwn<V>(record: Record<string, V>, key: string, value: V): void {
  Object.defineProperty(record, key, { value, enumerable: true, writable: true, configurable: true });
}

export function getOwn<V>(record: Readonly<Record<string, V>>, key: string): V | undefined {
  return Object.hasOwn(record, key) ? record[key] : undefined;
}
