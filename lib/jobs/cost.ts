/**
 * The ledger category a job's cost is booked under: the category that carries the largest share
 * of the quote's ex-GST amount (lines linked to a spec line carry its category); ties go to the
 * category met first. Work with no spec line at all falls back to `fallback`.
 */
export function costCategoryFor<C extends string>(amounts: readonly { category: C | null; exGstCents: number }[], fallback: C): C {
  const totals = new Map<C, number>();
  for (const { category, exGstCents } of amounts) {
    if (category === null) continue;
    totals.set(category, (totals.get(category) ?? 0) + Math.max(0, exGstCents));
  }
  let best: C | null = null;
  let bestCents = -1;
  for (const [category, cents] of totals) {
    if (cents > bestCents) {
      best = category;
      bestCents = cents;
    }
  }
  return best ?? fallback;
}
