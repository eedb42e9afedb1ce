import { useState, type ReactNode } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { formatCount } from '@shared/domain/decimal';
import { formatCents } from '@shared/domain/money';
import { VALUE_SOURCE_LABELS, type NumbersFacts, type RequestNumbersResult, type Sourced } from '@shared/domain/request-numbers';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { Icon, type IconName } from '@/components/ui/icon';
import { colors, radii, space, touch, tones, type Tone } from '@/theme';
import { useWide } from '@/theme/use-wide';

export interface NumbersCardProps {
  result: RequestNumbersResult;
  facts: NumbersFacts;
  /** The figures are computed from unsaved form values (shown with a word, not colour alone). */
  live?: boolean;
  /** Force the compact phone layout (e.g. beside a form on a wide screen). */
  compact?: boolean;
  /** Rendered at the end of the card (e.g. the engineer's "Edit the estimate" button). */
  footer?: ReactNode;
  testID?: string;
}

const money = (cents: number | null | undefined, currency: string) => (cents === null || cents === undefined ? '—' : formatCents(cents, currency));
const count = (n: number | null | undefined) => (n === null || n === undefined ? '—' : formatCount(n));
const plural = (n: number, one: string, many: string) => `${formatCount(n)} ${n === 1 ? one : many}`;

/** The verdict in words, with its tone and icon (never colour alone). */
export function verdictOf(result: RequestNumbersResult): { sentence: string; tone: Tone; icon: IconName; word: string } {
  const v = result.economics.verdict;
  if (v) return v.paysBack ? { sentence: v.sentence, tone: 'go', icon: 'done', word: 'Pays back' } : { sentence: v.sentence, tone: 'due', icon: 'warning', word: 'Does not pay back' };
  const first = result.missing[0];
  return { sentence: first ? `Payback not known yet. Still needed: ${first.charAt(0).toLowerCase()}${first.slice(1)}` : 'Payback not known yet.', tone: 'neutral', icon: 'info', word: 'Not known yet' };
}

/** Whether the tool lasts the planned run, in words. */
export function toolLastsOf(result: RequestNumbersResult): { title: string; detail: string; tone: Tone; icon: IconName } {
  const plan = result.run.plan;
  if (!plan) {
    return { title: 'Tool life: no run planned yet', detail: `${result.run.life.sentence} Enter the planned units to check the run.`, tone: 'neutral', icon: 'gauge' };
  }
  if (plan.enough) return { title: 'The tool lasts the run', detail: plan.summary, tone: 'go', icon: 'done' };
  return { title: 'Warning: the tool runs short', detail: plan.warning ?? plan.summary, tone: 'due', icon: 'warning' };
}

function Figure({ label, value, note, testID }: { label: string; value: string; note?: string; testID?: string }) {
  return (
    <View style={styles.figure}>
      <AppText variant="caption">{label}</AppText>
      <AppText variant="monoStrong" style={styles.figureValue} testID={testID}>
        {value}
      </AppText>
      {note ? <AppText variant="small">{note}</AppText> : null}
    </View>
  );
}

function Line({ label, value, note, strong, testID }: { label: string; value: string; note?: string; strong?: boolean; testID?: string }) {
  return (
    <View style={styles.line}>
      <View style={styles.lineLabel}>
        <AppText variant={strong ? 'label' : 'small'} style={strong ? undefined : styles.soft}>
          {label}
        </AppText>
        {note ? <AppText variant="monoSmall">{note}</AppText> : null}
      </View>
      <AppText variant={strong ? 'monoStrong' : 'mono'} testID={testID}>
        {value}
      </AppText>
    </View>
  );
}

function Notice({ tone, icon, title, detail, testID }: { tone: Tone; icon: IconName; title: string; detail?: string; testID?: string }) {
  const t = tones[tone];
  return (
    <View style={[styles.notice, { backgroundColor: t.bg, borderLeftColor: t.border }]} testID={testID}>
      <Icon name={icon} size={20} color={t.fg} strokeWidth={2} />
      <View style={styles.noticeText}>
        <AppText variant="bodyStrong" style={{ color: tone === 'neutral' ? colors.ink : t.fg }} testID={testID ? `${testID}-title` : undefined}>
          {title}
        </AppText>
        {detail ? <AppText variant="small">{detail}</AppText> : null}
      </View>
    </View>
  );
}

const from = (s: Sourced<unknown>) => (s.from === 'entered' ? undefined : VALUE_SOURCE_LABELS[s.from]);

function Block({ title, children, testID }: { title: string; children: ReactNode; testID?: string }) {
  return (
    <View style={styles.block} testID={testID}>
      <AppText variant="label" role="heading" aria-level={3}>
        {title}
      </AppText>
      {children}
    </View>
  );
}

function BuildUp({ result }: { result: RequestNumbersResult }) {
  const c = result.currency;
  const p = result.plan;
  const b = result.economics.buildUp;
  const brand = b?.steps.find((s) => s.stage === 'brand');
  const retailer = b?.steps.find((s) => s.stage === 'retailer');
  return (
    <Block title="Price build-up, per unit" testID="numbers-buildup">
      <Line label="FOB" note={from(p.fobCents)} value={money(p.fobCents.value, c)} testID="numbers-fob" />
      <Line label="Freight" note={from(p.freightPerUnitCents)} value={money(p.freightPerUnitCents.value, c)} />
      <Line label={`Duty${p.dutyPercent.value !== null ? ` (${p.dutyPercent.value} % of FOB)` : ''}`} note={from(p.dutyPercent)} value={money(p.dutyCents, c)} />
      <Line label="Landed cost" value={money(p.landedCents, c)} strong testID="numbers-landed" />
      <Line
        label="Wholesale"
        note={[from(p.wholesaleCents), brand?.marginPercent ? `brand margin ${brand.marginPercent} %` : null].filter(Boolean).join(' · ') || undefined}
        value={money(p.wholesaleCents.value, c)}
        testID="numbers-wholesale"
      />
      <Line
        label="Retail"
        note={[from(p.retailCents), retailer?.marginPercent ? `retailer margin ${retailer.marginPercent} %` : null].filter(Boolean).join(' · ') || undefined}
        value={money(p.retailCents.value, c)}
      />
      {b?.retailToFobMultiple ? <Line label="Retail as a multiple of FOB" value={`${b.retailToFobMultiple} ×`} /> : null}
    </Block>
  );
}

function Checks({ result }: { result: RequestNumbersResult }) {
  const { dimension: d, clamp: k } = result;
  if (!d && !k) return null;
  return (
    <Block title="Engineering checks" testID="numbers-checks">
      {d ? (
        <View style={styles.check} testID="numbers-dimension">
          <AppText variant="body">{d.change.sentence}</AppText>
          <AppText variant="monoSmall">
            {`${d.resin.name}, S = ${d.shrink} (${d.shrinkFrom === 'entered' ? 'datasheet value entered' : 'middle of the published range, a starting point'}). ${d.convention.label}: ${d.convention.formula}. Other convention: ${d.convention.id === 'astm_d955' ? d.conventions.shopShortcutMm : d.conventions.astmD955Mm} mm (${d.conventions.differenceMicrons} µm apart). ${d.rounding}`}
          </AppText>
          <AppText variant="small">{`Range source: ${d.resin.source}. ${d.caution}`}</AppText>
        </View>
      ) : null}
      {k ? (
        <View style={styles.check} testID="numbers-clamp">
          <Notice
            tone={k.check.pressOk === false ? 'due' : k.check.pressOk ? 'go' : 'neutral'}
            icon={k.check.pressOk === false ? 'warning' : k.check.pressOk ? 'done' : 'info'}
            title={k.check.pressOk === false ? 'Warning: press too small' : k.check.pressOk ? 'The press is big enough' : 'Press rating not known'}
            detail={k.check.sentence}
            testID="numbers-clamp-verdict"
          />
          <AppText variant="monoSmall">{`Factor ${k.factorUsed} ${k.factor.unitLabel} (${k.factor.resinLabel}, range ${k.factor.min}–${k.factor.max}; ${k.factorFrom === 'entered' ? 'entered' : 'upper end used'}).`}</AppText>
          <AppText variant="small">{`Source: ${k.factor.source}. ${k.check.caution}`}</AppText>
        </View>
      ) : null}
    </Block>
  );
}

function Notes({ result }: { result: RequestNumbersResult }) {
  const e = result.economics;
  const lists: [string, string[], Tone][] = [
    ['Problems', result.problems, 'due'],
    ['Still needed', result.missing, 'neutral'],
    ['Assumed', result.assumptions, 'neutral'],
    ['How these are computed', [e.rules.contribution, e.rules.breakEven, e.rules.amortisation, e.rules.priceBuildUp, result.run.rule], 'neutral'],
  ];
  return (
    <View style={styles.notes}>
      {lists
        .filter(([, items]) => items.length > 0)
        .map(([title, items, tone]) => (
          <View key={title} style={styles.noteList} testID={`numbers-notes-${title.split(' ')[0]!.toLowerCase()}`}>
            <AppText variant="caption" style={tone === 'due' ? { color: colors.due } : undefined}>
              {title}
            </AppText>
            {items.map((m) => (
              <AppText key={m} variant="small">
                {`• ${m}`}
              </AppText>
            ))}
          </View>
        ))}
    </View>
  );
}

/**
 * The numbers behind a cut: the verdict in words first, then what the cut costs, what each unit
 * carries, the break-even, whether the tool lasts the run and what keeping the ended products
 * would cost. Compact on a phone (the build-up and checks open on demand), a two-column panel on a
 * wide screen. Figures in IBM Plex Mono with the currency.
 */
export function NumbersCard({ result, facts, live, compact, footer, testID = 'numbers-card' }: NumbersCardProps) {
  const wide = useWide() && !compact;
  const [open, setOpen] = useState(false);
  const c = result.currency;
  const e = result.economics;
  const verdict = verdictOf(result);
  const lasts = toolLastsOf(result);
  const vt = tones[verdict.tone];
  const planned = result.plan.plannedUnits.value;
  const est = result.estimate;
  const modify = e.routes.find((r) => r.route === 'modify');
  const insert = e.routes.find((r) => r.route === 'new_insert');
  const duplicate = e.routes.find((r) => r.route === 'duplicate_tool');
  const endedNames = facts.ended.map((p) => `${p.sku} ${p.name}`).join(', ');

  const head = (
    <View style={styles.head}>
      <AppText variant="caption">{`The numbers · figures in ${c}`}</AppText>
      {live ? (
        <View style={styles.liveTag} testID={`${testID}-live`}>
          <Icon name="edit" size={14} color={colors.inkSoft} />
          <AppText variant="small">Not saved yet</AppText>
        </View>
      ) : null}
    </View>
  );

  const verdictBlock = (
    <View style={[styles.verdict, { backgroundColor: vt.bg, borderLeftColor: vt.border }]} testID={`${testID}-verdict`} role="status">
      <Icon name={verdict.icon} size={24} color={vt.fg} strokeWidth={2} />
      <View style={styles.noticeText}>
        <AppText variant="caption" style={{ color: verdict.tone === 'neutral' ? colors.inkFaint : vt.fg }}>
          {verdict.word}
        </AppText>
        <AppText variant="heading" testID={`${testID}-verdict-sentence`}>
          {verdict.sentence}
        </AppText>
      </View>
    </View>
  );

  const figures = (
    <View style={styles.figures}>
      <Figure label="Cost of the cut" value={money(est.modificationCostCents, c)} note={est.leadDays !== null ? `${plural(est.leadDays, 'day', 'days')} lead${est.trialRoundsExpected !== null ? `, ${plural(est.trialRoundsExpected, 'trial round', 'trial rounds')}` : ''}` : undefined} testID={`${testID}-cost`} />
      <Figure label="Tooling per unit" value={money(modify?.perUnitCents, c)} note={planned !== null ? `over ${count(planned)} planned` : 'planned units not known'} testID={`${testID}-per-unit`} />
      <Figure
        label="Break-even"
        value={e.breakEven ? (e.breakEven.units === null ? 'never' : `${count(e.breakEven.units)} units`) : '—'}
        note={e.breakEven && e.breakEven.units !== null ? `${money(e.breakEven.contributionCents, c)} a unit toward the cut` : undefined}
        testID={`${testID}-break-even`}
      />
    </View>
  );

  const life = <Notice tone={lasts.tone} icon={lasts.icon} title={lasts.title} detail={lasts.detail} testID={`${testID}-life`} />;

  const keep =
    facts.ended.length > 0 || insert?.costCents !== null || duplicate?.costCents !== null ? (
      <Block title={facts.ended.length ? `Keeping the ended products (${endedNames}, ${count(e.endedPlannedUnits)} planned)` : 'The alternatives'} testID={`${testID}-keep`}>
        {[insert, duplicate].map((r) =>
          r ? (
            <Line
              key={r.route}
              label={r.route === 'new_insert' ? 'New insert, keep the current one' : 'Duplicate tool'}
              note={r.perUnitCents !== null ? `${money(r.perUnitCents, c)} a unit` : r.costCents === null ? 'no estimate yet' : undefined}
              value={money(r.costCents, c)}
              testID={`${testID}-${r.route}`}
            />
          ) : null,
        )}
        {[e.alternatives.versusNewInsert, e.alternatives.versusDuplicateTool].map((s) =>
          s ? (
            <AppText key={s.alternative} variant="small">
              {s.sentence}
            </AppText>
          ) : null,
        )}
      </Block>
    ) : null;

  const detail = (
    <>
      <BuildUp result={result} />
      <Checks result={result} />
      <Notes result={result} />
    </>
  );

  if (wide) {
    return (
      <Card testID={testID} style={styles.card}>
        {head}
        {verdictBlock}
        <View style={styles.columns}>
          <View style={styles.column}>
            {figures}
            {life}
            {keep}
          </View>
          <View style={[styles.column, styles.rightColumn]}>{detail}</View>
        </View>
        {footer}
      </Card>
    );
  }
  return (
    <Card testID={testID} style={styles.card}>
      {head}
      {verdictBlock}
      {figures}
      {life}
      {keep}
      <Pressable
        role="button"
        aria-expanded={open}
        onPress={() => setOpen((o) => !o)}
        style={({ pressed }) => [styles.toggle, pressed && styles.pressed]}
        testID={`${testID}-more`}
      >
        <AppText variant="label">{open ? 'Hide the build-up and checks' : 'Show the build-up and checks'}</AppText>
        <Icon name={open ? 'chevron-down' : 'chevron-right'} size={18} color={colors.inkSoft} />
      </Pressable>
      {open ? detail : null}
      {footer}
    </Card>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.md },
  head: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  liveTag: { flexDirection: 'row', alignItems: 'center', gap: space.xs, paddingHorizontal: space.sm, paddingVertical: space.xxs, borderRadius: radii.pill, backgroundColor: colors.steelWash },
  verdict: { flexDirection: 'row', gap: space.md, padding: space.md, borderRadius: radii.md, borderLeftWidth: 4, alignItems: 'flex-start' },
  figures: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  figure: { flexGrow: 1, flexBasis: 140, gap: space.xxs, paddingVertical: space.xs },
  figureValue: { fontSize: 20, lineHeight: 28 },
  notice: { flexDirection: 'row', gap: space.sm, padding: space.md, borderRadius: radii.md, borderLeftWidth: 4, alignItems: 'flex-start' },
  noticeText: { flex: 1, gap: space.xxs },
  block: { gap: space.xs, paddingTop: space.sm, borderTopWidth: 1, borderTopColor: colors.steelLight },
  line: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'baseline', gap: space.md, paddingVertical: space.xxs },
  lineLabel: { flex: 1, gap: 0 },
  soft: { color: colors.inkSoft },
  check: { gap: space.xs },
  notes: { gap: space.sm, paddingTop: space.sm, borderTopWidth: 1, borderTopColor: colors.steelLight },
  noteList: { gap: space.xxs },
  columns: { flexDirection: 'row', gap: space.xl, alignItems: 'flex-start' },
  column: { flex: 1, gap: space.md, minWidth: 0 },
  rightColumn: { paddingLeft: space.xl, borderLeftWidth: 1, borderLeftColor: colors.steelLight },
  toggle: { minHeight: touch, flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', borderTopWidth: 1, borderTopColor: colors.steelLight, paddingTop: space.xs },
  pressed: { backgroundColor: colors.steelWash },
});
