/**
 * A small, total state machine: a table of legal moves, each with the reason words used when a
 * move is refused. The job, quote and evidence machines are built from it.
 */
export type Move<S extends string> = { from: S; to: S };

export type MoveCheck = { allowed: true } | { allowed: false; reason: string };

export interface StateMachine<S extends string> {
  states: readonly S[];
  /** Every legal move, in table order. */
  moves: readonly Move<S>[];
  labels: Readonly<Record<S, string>>;
  /** The states reachable from `from` in one move. */
  next(from: S): S[];
  /** Whether `from → to` is legal; when not, a sentence saying why, in the product's words. */
  check(from: S, to: S): MoveCheck;
  isState(value: unknown): value is S;
}

export function defineMachine<S extends string>(spec: {
  noun: string;
  states: readonly S[];
  labels: Readonly<Record<S, string>>;
  moves: Readonly<Partial<Record<S, readonly S[]>>>;
  /** Extra words for a refused move, e.g. why a final state is final. */
  finalReason?: Partial<Record<S, string>>;
}): StateMachine<S> {
  const moves: Move<S>[] = [];
  for (const from of spec.states) for (const to of spec.moves[from] ?? []) moves.push({ from, to });
  const isState = (value: unknown): value is S => typeof value === "string" && (spec.states as readonly string[]).includes(value);
  const next = (from: S): S[] => [...(spec.moves[from] ?? [])];
  return {
    states: spec.states,
    moves,
    labels: spec.labels,
    next,
    isState,
    check(from, to) {
      if (!isState(from)) return { allowed: false, reason: `"${String(from)}" is not a ${spec.noun} state` };
      if (!isState(to)) return { allowed: false, reason: `"${String(to)}" is not a ${spec.noun} state` };
      if (next(from).includes(to)) return { allowed: true };
      const fromLabel = spec.labels[from].toLowerCase();
      const toLabel = spec.labels[to].toLowerCase();
      if (from === to) return { allowed: false, reason: `The ${spec.noun} is already ${fromLabel}` };
      const options = next(from).map((s) => spec.labels[s].toLowerCase());
      const tail =
        spec.finalReason?.[from] ??
        (options.length === 0 ? `${fromLabel} is final` : `from ${fromLabel} it can only become ${options.join(" or ")}`);
      return { allowed: false, reason: `A ${spec.noun} that is ${fromLabel} cannot become ${toLabel}: ${tail}` };
    },
  };
}
