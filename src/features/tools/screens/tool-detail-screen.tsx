import { useCallback, useState, type ReactNode } from 'react';
import { useFocusEffect } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { retentionDecisionLabels, type ToolDetail } from '@shared/schemas/registry';
import { stateLabel, type RequestState } from '@shared/domain/lifecycle';
import { ToolStatusPill } from '@/components/registry/registry-status';
import { AppText } from '@/components/ui/app-text';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { DetailRow } from '@/components/ui/detail-row';
import { ErrorState } from '@/components/ui/error-state';
import { Icon } from '@/components/ui/icon';
import { Loading } from '@/components/ui/loading';
import { Screen } from '@/components/ui/screen';
import { Section } from '@/components/ui/section';
import { formatMoment } from '@/lib/registry-format';
import { colors, space } from '@/theme';
import { useWide } from '@/theme/use-wide';
import { HandlingCard } from '../components/handling-card';
import { LifeCard } from '../components/life-card';
import { PartsCard } from '../components/parts-card';
import { RetentionCard } from '../components/retention-card';
import { RevisionTimeline } from '../components/revision-timeline';
import { useCanEditRegistry, useTool } from '../hooks';
import { takeToolSaved } from '../saved-flash';

const back = { href: '/tools' as const, label: 'Tools' };

export interface ToolDetailScreenProps {
  toolId: string;
  /** The open plans of the tool's products against its life (composed by the route), under the life card. */
  openPlans?: ReactNode;
}

export function ToolDetailScreen({ toolId, openPlans }: ToolDetailScreenProps) {
  const tool = useTool(toolId);
  if (tool.isPending) return <Loading fill label="Loading tool…" />;
  if (tool.isError) {
    return (
      <Screen title="Tool" back={back} testID="tool-detail">
        <ErrorState error={tool.error} onRetry={() => void tool.refetch()} />
      </Screen>
    );
  }
  return <ToolDetailView tool={tool.data} openPlans={openPlans} onReload={() => void tool.refetch()} />;
}

function ToolDetailView({ tool, openPlans, onReload }: { tool: ToolDetail; openPlans: ReactNode; onReload: () => void }) {
  const wide = useWide();
  const canEdit = useCanEditRegistry();
  const [saved, setSaved] = useState(false);
  useFocusEffect(
    useCallback(() => {
      if (takeToolSaved(tool.id)) setSaved(true);
    }, [tool.id]),
  );

  const header = <ToolHeader tool={tool} />;
  const life = (
    <>
      <LifeCard tool={tool} />
      {openPlans}
    </>
  );
  const retention = <RetentionCard tool={tool} canEdit={canEdit} onReload={onReload} />;
  const handling = <HandlingCard handling={tool.handling} />;
  const makes = (
    <Section title="What it makes, by revision" description="Each product is bound to the revision whose geometry it needs." testID="tool-makes">
      <RevisionTimeline revisions={tool.revisions} />
    </Section>
  );
  const parts = <PartsCard tool={tool} />;
  const changes = <OpenChanges tool={tool} />;

  return (
    <Screen
      eyebrow={`Tool · ${tool.brand.name}`}
      title={tool.name}
      back={back}
      actions={canEdit && !tool.readOnly ? <Button title="Edit tool" icon="edit" variant="secondary" href={{ pathname: '/tools/[id]/edit', params: { id: tool.id } }} testID="tool-edit" /> : null}
      testID="tool-detail"
    >
      {saved ? <Banner kind="go" title="Changes saved" testID="tool-saved" /> : null}
      {tool.readOnly ? <DisposedBanner tool={tool} /> : null}
      {wide ? (
        <>
          {header}
          <View style={styles.columns}>
            <Column>
              {life}
              {retention}
              {handling}
            </Column>
            <Column>
              {makes}
              {parts}
              {changes}
            </Column>
          </View>
        </>
      ) : (
        <>
          {header}
          {life}
          {makes}
          {retention}
          {parts}
          {changes}
          {handling}
        </>
      )}
    </Screen>
  );
}

const Column = ({ children }: { children: ReactNode }) => <View style={styles.column}>{children}</View>;

function ToolHeader({ tool }: { tool: ToolDetail }) {
  return (
    <Card testID="tool-header">
      <View style={styles.codeRow}>
        <AppText variant="monoStrong" style={styles.code} testID="tool-code">
          {tool.code}
        </AppText>
        <ToolStatusPill status={tool.status} testID="tool-status" />
      </View>
      <View style={styles.facts}>
        <Fact icon="tag" label="Brand" value={`${tool.brand.name} (${tool.brand.code})`} />
        <Fact icon="factory" label="Factory" value={tool.factory.name} testID="tool-factory" />
        <Fact icon="pin" label="Location" value={tool.storageLocation ?? 'Not recorded'} />
        <Fact icon="history" label="Revision" value={`Rev ${tool.currentRevision}`} mono />
      </View>
    </Card>
  );
}

function Fact({ icon, label, value, mono, testID }: { icon: 'tag' | 'factory' | 'pin' | 'history'; label: string; value: string; mono?: boolean; testID?: string }) {
  return (
    <View style={styles.fact}>
      <Icon name={icon} size={18} color={colors.inkSoft} />
      <View style={styles.factText}>
        <AppText variant="caption">{label}</AppText>
        <AppText variant={mono ? 'mono' : 'body'} testID={testID}>
          {value}
        </AppText>
      </View>
    </View>
  );
}

function DisposedBanner({ tool }: { tool: ToolDetail }) {
  const d = tool.retention.decision;
  const what = d ? `${retentionDecisionLabels[d.decision]}: recorded by ${d.decidedBy?.name ?? 'unknown'} on ${formatMoment(d.decidedAt)}.` : '';
  return (
    <Banner kind="info" icon="lock" title="Disposed: this record is read-only" testID="tool-read-only">
      <AppText variant="body">
        {what} The tool is kept on record for its history and the products that used it; it can no longer be edited or changed.
      </AppText>
    </Banner>
  );
}

function OpenChanges({ tool }: { tool: ToolDetail }) {
  return (
    <Section title="Open change requests" testID="tool-open-changes">
      <Card>
        {tool.openChanges.length === 0 ? (
          <View style={styles.noChanges}>
            <Icon name="requests" size={20} color={colors.inkSoft} />
            <AppText variant="body" tone="soft" style={styles.factText}>
              No open change requests on this tool.
            </AppText>
          </View>
        ) : (
          tool.openChanges.map((c, i) => <DetailRow key={c.id} label={stateLabel(c.status as RequestState)} value={c.title} divider={i < tool.openChanges.length - 1} />)
        )}
      </Card>
    </Section>
  );
}

const styles = StyleSheet.create({
  columns: { flexDirection: 'row', gap: space.lg, alignItems: 'flex-start' },
  column: { flex: 1, gap: space.lg, minWidth: 0 },
  codeRow: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.md },
  code: { fontSize: 22, lineHeight: 28 },
  facts: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg },
  fact: { flexDirection: 'row', gap: space.sm, alignItems: 'flex-start', minWidth: 150, flexGrow: 1, flexBasis: 150 },
  factText: { flex: 1 },
  noChanges: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
});
