"use client";

import { useRef, useState } from "react";

/**
 * An editable list of rows in a calculator form (items, consumers, charging sources): each row
 * gets a stable `key` for React, and `update(key, part)` gives the change handler of one field.
 */
export function useRows<Row extends { key: number }>(start: ReadonlyArray<Omit<Row, "key">>, blank: Omit<Row, "key">) {
  const nextKey = useRef(start.length);
  const [rows, setRows] = useState<Row[]>(() => start.map((row, key) => ({ ...row, key }) as Row));
  return {
    rows,
    add: () => setRows((list) => [...list, { ...blank, key: nextKey.current++ } as Row]),
    remove: (key: number) => setRows((list) => list.filter((r) => r.key !== key)),
    update:
      <K extends Exclude<keyof Row, "key">>(key: number, part: K) =>
      (value: Row[K]) =>
        setRows((list) => list.map((r) => (r.key === key ? { ...r, [part]: value } : r))),
  };
}
