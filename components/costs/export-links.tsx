import { buttonClasses } from "@/components/ui";
import { filterQuery, type FilterValues } from "./query";

/** Download links for the filtered ledger; the same URLs work with a personal API token. */
export function ExportLinks({ values, base = "/api/costs/export", what = "ledger", testIdPrefix = "export" }: { values: FilterValues; base?: string; what?: string; testIdPrefix?: string }) {
  return (
    <>
      <a href={`${base}${filterQuery(values, { format: "csv" })}`} download className={buttonClasses({ variant: "secondary" })} data-testid={`${testIdPrefix}-csv`}>
        Download CSV<span className="sr-only"> of the {what}</span>
      </a>
      <a href={`${base}${filterQuery(values, { format: "xlsx" })}`} download className={buttonClasses({ variant: "secondary" })} data-testid={`${testIdPrefix}-xlsx`}>
        Download XLSX<span className="sr-only"> of the {what}</span>
      </a>
    </>
  );
}
