import { useState } from "react";
import { StyleSheet, View } from "react-native";
import { useRouter } from "expo-router";
import { FAMILY_WORDS } from "../../knowledge/contracts/advice";
import { STUBBORN_MIN_ATTEMPTS, type InsightResponse } from "../../knowledge/contracts/insight";
import { useLayout } from "../../hooks/breakpoints";
import { space } from "../../hooks/theme";
import { useInsightQuery, type InsightPeriod } from "../../hooks/use-insight";
import { formatMinutes } from "../cases/format";
import { Card } from "../ui/card";
import { Chips } from "../ui/chips";
import { Field } from "../ui/field";
import { Empty, ErrorState, Loading } from "../ui/states";
import { Text } from "../ui/text";
import type { DeskSectionProps } from "./desk-sections";
import { Bars, ChartCard, Columns } from "./insight-charts";
import { LinkRow } from "./link-row";

const DATE = /^\d{4}-\d{2}-\d{2}$/;
const MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];
const pct = (x: number) => `${Math.round(x * 100)} %`;
const familyWords = (f: string) => (f === "unknown" ? "solvents not in the tables" : (FAMILY_WORDS[f] ?? f));

type Preset = "3" | "12" | "36" | "custom";

/** The first day of the month `months − 1` months before today, as YYYY-MM-DD (UTC). */
function monthsBack(months: number, today = new Date()): string {
  return new Date(Date.UTC(today.getUTCFullYear(), today.getUTCMonth() - (months - 1), 1)).toISOString().slice(0, 10);
}

function monthLabel(key: string, withYear: boolean): string {
  const [y, m] = key.split("-");
  return `${MONTHS[Number(m) - 1] ?? m}${withYear ? ` ${y!.slice(2)}` : ""}`;
}

function RemedySuccess({ data }: { data: InsightResponse }) {
  const [family, setFamily] = useState<string | null>(null);
  const current = data.byFamily.find((f) => f.solventFamily === family) ?? data.byFamily[0];
  if (!current) return null;
  const rows = current.remedies.map((r) => ({
    key: r.remedyId,
    label: r.remedyTitle,
    fraction: r.rate,
    extra: r.partly / r.tried,
    value: `${r.cleared} of ${r.tried} · ${pct(r.rate)}`,
  }));
  const sentence = `${familyWords(current.solventFamily)}: ${current.remedies.map((r) => `${r.remedyTitle} cleared ${r.cleared} of ${r.tried}`).join("; ")}.`;
  return (
    <ChartCard
      title="What clears emulsions here"
      summary="Share of attempts that cleared, by the extraction solvent's family; the lighter part partly cleared."
      numbers={data.byFamily.flatMap((f) => f.remedies.map((r) => `${familyWords(f.solventFamily)} · ${r.remedyTitle}: cleared ${r.cleared}, partly ${r.partly}, of ${r.tried} tried (${pct(r.rate)})`))}
      testID="insight-success"
    >
      <Chips
        label="Solvent family"
        options={data.byFamily.map((f) => ({ value: f.solventFamily, label: `${familyWords(f.solventFamily)} (${f.tried})` }))}
        selected={current.solventFamily}
        onSelect={setFamily}
        scroll
        testID="insight-family"
      />
      <Bars rows={rows} description={sentence} color="good" testID="insight-success-bars" />
    </ChartCard>
  );
}

function TimeToClear({ data }: { data: InsightResponse }) {
  const t = data.timeToClear;
  const max = Math.max(1, ...t.byRemedy.map((r) => r.medianMinutes));
  const headline = t.medianMinutes === null ? "No case cleared with timed attempts in this period." : `Median ${formatMinutes(t.medianMinutes)} to clear, over ${t.cases} cases`;
  return (
    <ChartCard
      title="Time to clear"
      summary={`Minutes spent on attempts up to the one that cleared.${t.untimed ? ` ${t.untimed} cleared cases had an untimed attempt and are left out.` : ""}`}
      numbers={[headline, ...t.byRemedy.map((r) => `${r.remedyTitle}: median ${formatMinutes(r.medianMinutes)} for the clearing attempt (${r.cases} cases)`)]}
      testID="insight-time"
    >
      <Text size="answer" bold testID="insight-median">
        {t.medianMinutes === null ? "—" : formatMinutes(t.medianMinutes)}
      </Text>
      <Text tone="inkMuted">{headline}</Text>
      {t.byRemedy.length ? (
        <Bars
          rows={t.byRemedy.map((r) => ({ key: r.remedyId, label: r.remedyTitle, fraction: r.medianMinutes / max, value: formatMinutes(r.medianMinutes) }))}
          description={`Median minutes of the attempt that cleared: ${t.byRemedy.map((r) => `${r.remedyTitle} ${formatMinutes(r.medianMinutes)}`).join("; ")}.`}
          color="info"
        />
      ) : null}
      {t.byRemedy.length ? (
        <Text size="caption" tone="inkMuted">
          Bars: median minutes of the attempt that cleared, by remedy.
        </Text>
      ) : null}
    </ChartCard>
  );
}

function PerMonth({ data }: { data: InsightResponse }) {
  const years = new Set(data.perMonth.map((m) => m.month.slice(0, 4)));
  const cols = data.perMonth.map((m) => ({ key: m.month, label: monthLabel(m.month, years.size > 1), total: m.cases, part: m.resolved }));
  const busiest = [...data.perMonth].sort((a, b) => b.cases - a.cases)[0];
  return (
    <ChartCard
      title="Cases per month"
      summary={busiest && busiest.cases ? `Busiest: ${monthLabel(busiest.month, true)} with ${busiest.cases} cases.` : "No cases in this period."}
      numbers={data.perMonth.map((m) => `${monthLabel(m.month, true)}: ${m.cases} cases, ${m.resolved} resolved`)}
      testID="insight-months"
    >
      <Columns data={cols} description={`Cases per month: ${data.perMonth.map((m) => `${monthLabel(m.month, true)} ${m.cases} (${m.resolved} resolved)`).join(", ")}.`} testID="insight-months-chart" />
    </ChartCard>
  );
}

function Solvents({ data }: { data: InsightResponse }) {
  const max = Math.max(1, ...data.solvents.map((s) => s.cases));
  return (
    <ChartCard
      title="Solvents the group uses most"
      summary="Cases that used each organic solvent (a case counts once per solvent)."
      numbers={data.solvents.map((s) => `${s.name}: ${s.cases} cases`)}
      testID="insight-solvents"
    >
      <Bars
        rows={data.solvents.map((s) => ({ key: s.key ?? s.name, label: s.name, fraction: s.cases / max, value: `${s.cases}` }))}
        description={`Cases per solvent: ${data.solvents.map((s) => `${s.name} ${s.cases}`).join(", ")}.`}
        color="organic"
      />
    </ChartCard>
  );
}

function Stubborn({ data }: { data: InsightResponse }) {
  const router = useRouter();
  return (
    <Card testID="insight-stubborn">
      <Text size="title" bold accessibilityRole="header">
        Stubborn open cases ({data.stubborn.length})
      </Text>
      <Text tone="inkMuted">Still open after {STUBBORN_MIN_ATTEMPTS} or more attempts, none of which cleared it.</Text>
      {data.stubborn.length === 0 ? <Text>None in this period.</Text> : null}
      {data.stubborn.map((s) => (
        <View key={s.id} style={styles.stubborn}>
          <LinkRow
            label={s.title}
            detail={`${s.authorName} · ${s.solvents.join(" + ")} · ${s.attempts} attempts · open ${s.openDays} days`}
            onPress={() => router.push(`/cases/${s.id}` as never)}
          />
        </View>
      ))}
    </Card>
  );
}

/** Desk › Insight: how the group's work-ups go, over a period. */
export function InsightSection(_: DeskSectionProps) {
  const layout = useLayout();
  const [preset, setPreset] = useState<Preset>("12");
  const [from, setFrom] = useState("");
  const [to, setTo] = useState("");
  const period: InsightPeriod =
    preset === "custom" ? { ...(DATE.test(from) ? { from } : {}), ...(DATE.test(to) ? { to } : {}) } : { from: monthsBack(Number(preset)) };
  const q = useInsightQuery(period);
  const dateError = (v: string) => (v && !DATE.test(v) ? "Use a date like 2025-03-14." : undefined);
  const d = q.data;
  // A grid cell on a wide screen; in the phone's single column a basis would become a height.
  const cell = layout === "wide" ? styles.cell : undefined;
  return (
    <View style={styles.section}>
      <Chips
        label="Period"
        options={[
          { value: "3", label: "Last 3 months" },
          { value: "12", label: "Last 12 months" },
          { value: "36", label: "Last 3 years" },
          { value: "custom", label: "Choose dates" },
        ]}
        selected={preset}
        onSelect={(v) => setPreset(v as Preset)}
        scroll
        testID="insight-period"
      />
      {preset === "custom" ? (
        <View style={styles.dates}>
          <View style={styles.date}>
            <Field label="From" value={from} onChangeText={setFrom} placeholder="2025-01-01" error={dateError(from)} testID="insight-from" />
          </View>
          <View style={styles.date}>
            <Field label="To" value={to} onChangeText={setTo} placeholder="2025-03-31" error={dateError(to)} testID="insight-to" />
          </View>
        </View>
      ) : null}
      {q.isPending ? (
        <Loading label="Counting the group's cases…" />
      ) : q.isError ? (
        <ErrorState error={q.error} onRetry={() => q.refetch()} />
      ) : !d || d.totals.cases === 0 ? (
        <Empty title="No cases in this period" body="Insight counts the group's logged cases. Pick a longer period, or log work-ups in the case log." />
      ) : (
        <>
          <Text testID="insight-totals">
            {d.period.from} to {d.period.to}: <Text bold>{d.totals.cases} cases</Text> ({d.totals.open} open, {d.totals.resolved} resolved, {d.totals.abandoned} abandoned), {d.totals.attempts} attempts.
          </Text>
          <View style={layout === "wide" ? styles.grid : styles.stack}>
            <View style={cell}>
              <RemedySuccess data={d} />
            </View>
            <View style={cell}>
              <TimeToClear data={d} />
            </View>
            <View style={cell}>
              <PerMonth data={d} />
            </View>
            <View style={cell}>
              <Solvents data={d} />
            </View>
            <View style={cell}>
              <Stubborn data={d} />
            </View>
          </View>
        </>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  section: { gap: space.lg },
  dates: { flexDirection: "row", flexWrap: "wrap", gap: space.md },
  date: { flexGrow: 1, flexBasis: 160 },
  grid: { flexDirection: "row", flexWrap: "wrap", gap: space.lg, alignItems: "flex-start" },
  stack: { gap: space.lg },
  cell: { flexGrow: 1, flexBasis: 420, minWidth: 0 },
  stubborn: { gap: 2 },
});
