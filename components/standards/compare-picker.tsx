import { Button, Field, Select } from "@/components/ui";

type Option = { id: string; number: number; status: string };

/** Two editions to compare: a plain GET form, so the comparison has its own address. */
export function ComparePicker({ standardId, editions, a, b }: { standardId: string; editions: Option[]; a?: string; b?: string }) {
  if (editions.length < 2) return null;
  const sorted = [...editions].sort((x, y) => x.number - y.number);
  const first = a ?? sorted[sorted.length - 2]!.id;
  const second = b ?? sorted[sorted.length - 1]!.id;
  return (
    <form action={`/standards/${standardId}/compare`} method="get" className="flex flex-wrap items-end gap-3">
      <Field label="Compare edition" id="compare-a">
        <Select name="a" defaultValue={first}>
          {sorted.map((e) => (
            <option key={e.id} value={e.id}>
              Edition {e.number} ({e.status})
            </option>
          ))}
        </Select>
      </Field>
      <Field label="with edition" id="compare-b">
        <Select name="b" defaultValue={second}>
          {sorted.map((e) => (
            <option key={e.id} value={e.id}>
              Edition {e.number} ({e.status})
            </option>
          ))}
        </Select>
      </Field>
      <Button type="submit" variant="secondary">
        Compare
      </Button>
    </form>
  );
}
