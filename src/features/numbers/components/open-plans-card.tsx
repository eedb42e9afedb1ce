import { StyleSheet, View } from 'react-native';
import { formatCount } from '@shared/domain/decimal';
import { stateLabel } from '@shared/domain/lifecycle';
import type { ToolOpenPlans } from '@shared/schemas/numbers';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { ErrorState } from '@/components/ui/error-state';
import { Icon } from '@/components/ui/icon';
import { ListRow } from '@/components/ui/list-row';
import { Loading } from '@/components/ui/loading';
import { Section } from '@/components/ui/section';
import { colors, radii, space, tones, type Tone } from '@/theme';
import { useToolOpenPlans } from '../hooks';

export interface OpenPlansCardProps {
  toolId: string;
  testID?: string;
}

/** The tool's remaining rated life against the runs of all its open changes, with a warning when they outrun it. */
export function OpenPlansView({ data, testID = 'open-plans' }: { data: ToolOpenPlans; testID?: string }) {
  const total = data.total;
  const tone: Tone = total.plansCounted === 0 ? 'neutral' : total.enough ? 'go' : 'due';
  const t = tones[tone];
  const title = total.plansCounted === 0 ? 'No run planned yet' : total.enough ? 'The tool lasts all open plans' : 'Warning: the open plans outrun the tool';
  return (
    <View style={styles.wrap} testID={testID}>
      <View style={[styles.verdict, { backgroundColor: t.bg, borderLeftColor: t.border }]} role="status" testID={`${testID}-verdict`}>
        <Icon name={tone === 'due' ? 'warning' : tone === 'go' ? 'done' : 'gauge'} size={22} color={t.fg} strokeWidth={2} />
        <View style={styles.text}>
          <AppText variant="bodyStrong" style={{ color: tone === 'neutral' ? colors.ink : t.fg }}>
            {title}
          </AppText>
          <AppText variant="small" testID={`${testID}-summary`}>
            {total.summary}
          </AppText>
        </View>
      </View>
      <View style={styles.figures}>
        <View style={styles.figure}>
          <AppText variant="caption">Shots left</AppText>
          <AppText variant="monoStrong" style={styles.big} testID={`${testID}-remaining`}>
            {formatCount(total.remainingShots)}
          </AppText>
        </View>
        <View style={styles.figure}>
          <AppText variant="caption">All open plans</AppText>
          <AppText variant="monoStrong" style={styles.big} testID={`${testID}-total`}>
            {formatCount(total.totalShots)}
          </AppText>
        </View>
        {total.shortfall > 0 ? (
          <View style={styles.figure}>
            <AppText variant="caption" style={{ color: colors.due }}>
              Short by
            </AppText>
            <AppText variant="monoStrong" style={[styles.big, { color: colors.due }]} testID={`${testID}-shortfall`}>
              {formatCount(total.shortfall)}
            </AppText>
          </View>
        ) : null}
      </View>
      {data.plans.length ? (
        <Card padded={false}>
          {data.plans.map((p, i) => (
            <ListRow
              key={p.requestId}
              meta={`${p.ref} · ${stateLabel(p.status)}`}
              title={p.title}
              subtitle={
                p.shotsNeeded === null
                  ? 'No planned units yet'
                  : `${formatCount(p.plannedUnits ?? 0)} units${p.derivative ? ` of ${p.derivative.sku}` : ''} · ${formatCount(p.shotsNeeded)} shots${p.governingPart ? ` (${p.governingPart})` : ''}`
              }
              href={{ pathname: '/requests/[id]', params: { id: p.requestId } }}
              divider={i < data.plans.length - 1}
              testID={`${testID}-row-${p.ref}`}
            />
          ))}
        </Card>
      ) : null}
      <AppText variant="small">{`${total.rule} Rated life: ${data.tool.ratedShotsSource}`}</AppText>
    </View>
  );
}

export function OpenPlansCard({ toolId, testID = 'open-plans' }: OpenPlansCardProps) {
  const q = useToolOpenPlans(toolId);
  return (
    <Section title="Life versus open plans" description="The shots every open change plans on this tool, against the shots it has left." testID={`${testID}-section`}>
      {q.isPending ? (
        <Loading label="Adding up the open plans…" testID={`${testID}-loading`} />
      ) : q.isError ? (
        <ErrorState error={q.error} onRetry={() => void q.refetch()} testID={`${testID}-error`} />
      ) : (
        <Card>
          <OpenPlansView data={q.data} testID={testID} />
        </Card>
      )}
    </Section>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  verdict: { flexDirection: 'row', gap: space.md, padding: space.md, borderRadius: radii.md, borderLeftWidth: 4, alignItems: 'flex-start' },
  text: { flex: 1, gap: space.xxs },
  figures: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg },
  figure: { gap: space.xxs, minWidth: 120 },
  big: { fontSize: 20, lineHeight: 28 },
});
