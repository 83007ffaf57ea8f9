import { Document, Page, StyleSheet, Text, View, renderToBuffer } from "@react-pdf/renderer";
import type { ReactNode } from "react";
import type { StatementData } from "./types";
import { formatCalendarDay, formatDay } from "@/lib/format/dates";

/**
 * The printable mass statement: an A4 PDF laid out from StatementData with the standard PDF
 * fonts (nothing is fetched). Text stays within the fonts' Latin-1 repertoire.
 */

const INK = "#131e33";
const MUTED = "#5d5140";
const LINE = "#e8dfcc";
const ACCENT = "#283c61";
const OK = "#4c624d";
const DANGER = "#973f25";
const WARN_SOFT = "#f7ebc2";
const WARN_INK = "#523d12";

const styles = StyleSheet.create({
  page: { paddingTop: 36, paddingBottom: 56, paddingHorizontal: 40, fontSize: 9, fontFamily: "Helvetica", color: INK, lineHeight: 1.35 },
  brand: { fontSize: 9, color: ACCENT, fontFamily: "Helvetica-Bold", letterSpacing: 1 },
  title: { fontSize: 18, fontFamily: "Helvetica-Bold", marginTop: 6, lineHeight: 1.2 },
  subtitle: { fontSize: 10, color: MUTED, marginTop: 4 },
  facts: { flexDirection: "row", flexWrap: "wrap", marginTop: 10, borderTopWidth: 1, borderTopColor: LINE, paddingTop: 8 },
  fact: { width: "33%", marginBottom: 6 },
  factLabel: { fontSize: 7.5, color: MUTED, textTransform: "uppercase" },
  factValue: { fontSize: 9.5, fontFamily: "Helvetica-Bold" },
  section: { marginTop: 14 },
  heading: { fontSize: 11, fontFamily: "Helvetica-Bold", color: ACCENT, marginBottom: 5 },
  row: { flexDirection: "row", borderBottomWidth: 0.75, borderBottomColor: LINE, paddingVertical: 3 },
  headRow: { flexDirection: "row", borderBottomWidth: 1, borderBottomColor: MUTED, paddingBottom: 3 },
  th: { fontSize: 7.5, color: MUTED, fontFamily: "Helvetica-Bold", textTransform: "uppercase", paddingRight: 8 },
  cell: { paddingRight: 8 },
  num: { textAlign: "right" },
  caution: { backgroundColor: WARN_SOFT, color: WARN_INK, padding: 8, borderRadius: 3, marginTop: 12 },
  cautionText: { fontFamily: "Helvetica-Bold", fontSize: 8.5 },
  binding: { marginTop: 8, padding: 8, borderWidth: 1, borderColor: ACCENT, borderRadius: 3 },
  bindingText: { fontSize: 11, fontFamily: "Helvetica-Bold" },
  bullet: { flexDirection: "row", marginBottom: 2 },
  footer: { position: "absolute", bottom: 22, left: 40, right: 40, fontSize: 7, color: MUTED, borderTopWidth: 0.75, borderTopColor: LINE, paddingTop: 4 },
});

const nf = new Intl.NumberFormat("en-AU", { maximumFractionDigits: 0, minimumFractionDigits: 0 });
const nf1 = new Intl.NumberFormat("en-AU", { maximumFractionDigits: 1, minimumFractionDigits: 1 });
const signed = new Intl.NumberFormat("en-AU", { maximumFractionDigits: 0, signDisplay: "exceptZero" });

/** "1,234 kg" ("0.2 kg" for small part-kilogram items); negative zero and NaN never reach the page. */
export function kg(value: number | null | undefined, withSign = false): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "-";
  if (!withSign && Math.abs(value) < 10 && !Number.isInteger(value)) return `${nf1.format(value)} kg`;
  const rounded = Math.round(value) === 0 ? 0 : value;
  return `${(withSign ? signed : nf).format(rounded)} kg`;
}


function Fact({ label, value }: { label: string; value: string | null }) {
  return (
    <View style={styles.fact}>
      <Text style={styles.factLabel}>{label}</Text>
      <Text style={styles.factValue}>{value ?? "-"}</Text>
    </View>
  );
}

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <View style={styles.section}>
      <Text style={styles.heading} minPresenceAhead={40}>
        {title}
      </Text>
      {children}
    </View>
  );
}

type Col = { title: string; width: string; numeric?: boolean };

function Table({ cols, rows }: { cols: Col[]; rows: ReactNode[][] }) {
  return (
    <View>
      <View style={styles.headRow} fixed minPresenceAhead={24}>
        {cols.map((c) => (
          <Text key={c.title} style={[styles.th, { width: c.width }, c.numeric ? styles.num : {}]}>
            {c.title}
          </Text>
        ))}
      </View>
      {rows.map((cells, i) => (
        <View key={i} style={styles.row} wrap={false}>
          {cells.map((cell, j) => {
            const col = cols[j];
            return (
              <View key={j} style={[styles.cell, { width: col?.width ?? "auto" }]}>
                {typeof cell === "string" ? <Text style={col?.numeric ? styles.num : {}}>{cell}</Text> : cell}
              </View>
            );
          })}
        </View>
      ))}
    </View>
  );
}

function Status({ ok }: { ok: boolean }) {
  return (
    <View style={{ flexDirection: "row", alignItems: "center" }}>
      <View style={{ width: 6, height: 6, backgroundColor: ok ? OK : DANGER, borderRadius: ok ? 3 : 0, marginRight: 4 }} />
      <Text style={{ color: ok ? OK : DANGER, fontFamily: "Helvetica-Bold" }}>{ok ? "Within" : "Over"}</Text>
    </View>
  );
}

function Bullets({ items }: { items: string[] }) {
  return (
    <View>
      {items.map((text, i) => (
        <View key={i} style={styles.bullet}>
          <Text style={{ width: 10 }}>-</Text>
          <Text style={{ flex: 1 }}>{text}</Text>
        </View>
      ))}
    </View>
  );
}

export function StatementDocument({ data }: { data: StatementData }) {
  const v = data.vehicle;
  return (
    <Document title={`Mass statement ${v.fleetNumber}`} author="Rigline" subject={`Mass and fit-out of ${v.fleetNumber}`} creator="Rigline" producer="Rigline">
      <Page size="A4" style={styles.page}>
        <Text style={styles.brand}>RIGLINE — MASS STATEMENT</Text>
        <Text style={styles.title}>{v.fleetNumber}</Text>
        <Text style={styles.subtitle}>{v.platform}</Text>
        <View style={styles.facts}>
          <Fact label="Registration" value={v.registration} />
          <Fact label="VIN" value={v.vin} />
          <Fact label="Depot" value={v.depot} />
          <Fact label="Organisation" value={data.orgName} />
          <Fact label="Prepared" value={`${formatDay(data.generatedAt, data.timeZone)} by ${data.generatedBy}`} />
          <Fact label="Figures include" value={data.includePlanned ? "Fitted and planned items" : "Fitted items only"} />
        </View>

        <View style={styles.caution}>
          {data.cautions.map((c) => (
            <Text key={c} style={styles.cautionText}>
              {c}
            </Text>
          ))}
        </View>

        <Section title="Loading">
          <Text>{data.loadingText}</Text>
          <Text style={{ color: MUTED, marginTop: 2 }}>{data.baseText}</Text>
        </Section>

        <Section title="Axle loads and headroom">
          <Table
            cols={[
              { title: "Limit", width: "34%" },
              { title: "Load", width: "16%", numeric: true },
              { title: "Rating", width: "16%", numeric: true },
              { title: "Headroom", width: "18%", numeric: true },
              { title: "", width: "16%" },
            ]}
            rows={data.checks.map((c) => [
              c.label,
              kg(c.loadKg),
              kg(c.capacityKg),
              kg(c.headroomKg, true),
              <View key="s" style={{ paddingLeft: 10 }}>
                <Status ok={c.ok} />
              </View>,
            ])}
          />
          {data.binding ? (
            <View style={styles.binding}>
              <Text style={styles.bindingText}>
                Binding limit: {data.binding.label} — {data.binding.marginKg < 0 ? `${kg(-data.binding.marginKg)} over` : `${kg(data.binding.marginKg)} to spare`}
              </Text>
            </View>
          ) : (
            <Text style={{ marginTop: 6 }}>{"No limit could be checked: the maker's figures are missing."}</Text>
          )}
          {data.payload && (
            <Text style={{ marginTop: 6 }}>
              Payload: {kg(data.payload.capacityKg)} capacity, {kg(data.payload.usedKg)} used, {kg(data.payload.leftKg)} left.
              {data.aboveStandardKg !== null ? ` Loaded mass ${kg(data.aboveStandardKg)} above standard.` : ""}
            </Text>
          )}
        </Section>

        {(data.warnings.length > 0 || data.missing.length > 0) && (
          <Section title="Warnings and missing figures">
            <Bullets items={[...data.warnings, ...data.missing]} />
          </Section>
        )}

        <Section title="Tyres">
          <Text>
            In use: {data.tyres.size ?? "not recorded"} ({data.tyres.source})
            {data.tyres.loadIndex !== null ? `, load index ${data.tyres.loadIndex}` : ""}.
          </Text>
          {data.tyres.capacityText.length > 0 && <Bullets items={data.tyres.capacityText} />}
        </Section>

        <Section title="Suspension">
          <Table
            cols={[
              { title: "Axle", width: "16%" },
              { title: "Constant load", width: "22%", numeric: true },
              { title: "Variable load", width: "22%", numeric: true },
              { title: "Springs that suit", width: "40%", numeric: true },
            ]}
            rows={data.suspension.map((s) => [s.axle, kg(s.constantKg), kg(s.variableKg), `${kg(s.suggestedMinKg)} up to ${kg(s.suggestedMaxKg)}`])}
          />
          <Text style={{ color: MUTED, marginTop: 4 }}>
            Loads over standard. Springs are rated for the constant load (accessories); airbags may help only with the variable load.
          </Text>
        </Section>

        <Section title="Fitted lines">
          {data.fitted.length === 0 ? (
            <Text>Nothing is recorded as fitted.</Text>
          ) : (
            <Table
              cols={[
                { title: "Line", width: "12%" },
                { title: "Item", width: "38%" },
                { title: "Qty", width: "7%", numeric: true },
                { title: "Mass", width: "13%", numeric: true },
                { title: "Position", width: "16%" },
                { title: "Evidence", width: "14%" },
              ]}
              rows={data.fitted.map((f) => [f.code, f.label, String(f.quantity), kg(f.massKg), f.position, f.evidence])}
            />
          )}
        </Section>

        {data.includePlanned && (
          <Section title="Planned items (what-if)">
            {data.planned.length === 0 ? (
              <Text>No items are planned.</Text>
            ) : (
              <Table
                cols={[
                  { title: "Item", width: "50%" },
                  { title: "Mass", width: "15%", numeric: true },
                  { title: "Position", width: "20%" },
                  { title: "Kind", width: "15%" },
                ]}
                rows={data.planned.map((p) => [p.label, kg(p.massKg), p.position, p.kind])}
              />
            )}
          </Section>
        )}

        <Section title="12 V plan">
          {data.electrical ? (
            <View>
              <Text>
                {data.electrical.consumers} consumer{data.electrical.consumers === 1 ? "" : "s"} use {nf.format(data.electrical.dailyWh)} Wh a day = {nf1.format(data.electrical.dailyAh)} Ah at{" "}
                {data.electrical.systemV} V. For {nf1.format(data.electrical.daysAutonomy)} day{data.electrical.daysAutonomy === 1 ? "" : "s"} of autonomy with {data.electrical.chemistry} at{" "}
                {nf.format(data.electrical.usableDepthPct)} % usable: {nf.format(data.electrical.requiredCapacityAh)} Ah needed ({data.electrical.suggestedBattery}).
              </Text>
              {data.electrical.rechargeText && <Text style={{ marginTop: 2 }}>{data.electrical.rechargeText}</Text>}
              {data.electrical.runs.length > 0 && (
                <View style={{ marginTop: 4 }}>
                  <Table
                    cols={[
                      { title: "Cable run", width: "27%" },
                      { title: "Load", width: "15%", numeric: true },
                      { title: "Cable", width: "13%", numeric: true },
                      { title: "Drop", width: "17%", numeric: true },
                      { title: "Fuse", width: "9%", numeric: true },
                      { title: "Fuse goes", width: "19%" },
                    ]}
                    rows={data.electrical.runs.map((r) => [
                      `${r.label} (${r.circuit})`,
                      `${nf1.format(r.currentA)} A, ${nf1.format(r.lengthOneWayM)} m`,
                      r.size,
                      `${r.dropV.toFixed(2)} V (${nf1.format(r.dropPct)} %)${r.withinLimit ? "" : " over"}`,
                      `${nf.format(r.fuseA)} A`,
                      r.fuseLocation,
                    ])}
                  />
                </View>
              )}
              <Text style={{ color: MUTED, marginTop: 4 }}>{data.electrical.savedText}</Text>
            </View>
          ) : (
            <Text>No 12 V plan is saved for this vehicle.</Text>
          )}
        </Section>

        <Section title="Weighbridge">
          {data.measured ? (
            <Text>
              Last weighed{data.measured.measuredAt ? ` on ${formatCalendarDay(data.measured.measuredAt)}` : ""}: front {kg(data.measured.frontKg)}, rear {kg(data.measured.rearKg)}
              {data.measured.grossKg !== null ? `, gross ${kg(data.measured.grossKg)}` : ""}.
            </Text>
          ) : (
            <Text>{"No weighbridge ticket is recorded: the figures start from the maker's kerb masses."}</Text>
          )}
        </Section>

        <Section title="Rule set used">
          <Text style={{ fontFamily: "Helvetica-Bold" }}>
            {data.ruleSet.name} ({data.ruleSet.label})
          </Text>
          <Text style={{ marginTop: 2 }}>{data.ruleSet.note}</Text>
        </Section>

        <Text
          style={styles.footer}
          fixed
          render={({ pageNumber, totalPages }) =>
            `${v.fleetNumber} — planning aid, not a certificate. Weigh on a certified weighbridge; modifications are decided under local rules by an authorised vehicle engineer. Page ${pageNumber} of ${totalPages}`
          }
        />
      </Page>
    </Document>
  );
}

/** The statement as PDF bytes. */
export async function renderStatementPdf(data: StatementData): Promise<Buffer> {
  return renderToBuffer(<StatementDocument data={data} />);
}
