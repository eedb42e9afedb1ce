import { Link } from 'expo-router';
import { Pressable, StyleSheet, View } from 'react-native';
import type { Tool } from '@shared/schemas/registry';
import { DataTable, type Column } from '@/components/registry/data-table';
import { LifeGauge } from '@/components/registry/life-gauge';
import { RetentionMarker, ToolStatusPill, retentionLook } from '@/components/registry/registry-status';
import { AppText } from '@/components/ui/app-text';
import { Icon } from '@/components/ui/icon';
import { StatusPill } from '@/components/ui/status-pill';
import { colors, radii, space, touch } from '@/theme';

const toolHref = (t: Tool) => ({ pathname: '/tools/[id]' as const, params: { id: t.id } });

/** Phone: one card-like row per tool with its code, name, place, life gauge and retention marker. */
export function ToolRows({ tools }: { tools: readonly Tool[] }) {
  return (
    <View style={styles.list} testID="tool-rows" role="list">
      {tools.map((t) => (
        <Link key={t.id} href={toolHref(t)} asChild>
          <Pressable style={styles.row} role="link" accessibilityLabel={`Open tool ${t.code}, ${t.name}`} testID={`tool-row-${t.code}`}>
            <View style={styles.rowBody}>
              <View style={styles.rowTop}>
                <AppText variant="monoStrong">{t.code}</AppText>
                <ToolStatusPill status={t.status} />
              </View>
              <AppText variant="bodyStrong" numberOfLines={2}>
                {t.name}
              </AppText>
              <AppText variant="small" numberOfLines={1}>
                {t.brand.name} · {t.factory.name}
              </AppText>
              <View style={styles.gauge}>
                <LifeGauge life={t.life} compact testID={`tool-row-${t.code}-life`} />
              </View>
              <RetentionMarker retention={t.retention} status={t.status} onlyWhenDue testID={`tool-row-${t.code}-retention`} />
            </View>
            <Icon name="chevron-right" size={20} color={colors.steel} />
          </Pressable>
        </Link>
      ))}
    </View>
  );
}

const columns: readonly Column<Tool>[] = [
  { key: 'code', header: 'Code', width: 104, render: (t) => <AppText variant="monoStrong">{t.code}</AppText> },
  {
    key: 'tool',
    header: 'Tool',
    flex: 1.6,
    render: (t) => (
      <View style={styles.cellText}>
        <AppText variant="bodyStrong" numberOfLines={2}>
          {t.name}
        </AppText>
        <AppText variant="small" numberOfLines={1}>
          {t.brand.name}
        </AppText>
      </View>
    ),
  },
  {
    key: 'factory',
    header: 'Factory',
    flex: 1.2,
    render: (t) => (
      <View style={styles.cellText}>
        <AppText variant="body" numberOfLines={2}>
          {t.factory.name}
        </AppText>
        <AppText variant="small" numberOfLines={1}>
          {t.storageLocation ?? 'Location not recorded'}
        </AppText>
      </View>
    ),
  },
  { key: 'status', header: 'Status', width: 134, render: (t) => <ToolStatusPill status={t.status} /> },
  { key: 'life', header: 'Life used', width: 168, render: (t) => <LifeGauge life={t.life} compact testID={`tool-table-${t.code}-life`} /> },
  {
    key: 'retention',
    header: 'Keep or scrap',
    width: 150,
    render: (t) => {
      const look = retentionLook(t.retention, t.status, true);
      return look.due ? (
        <StatusPill label={look.label} icon={look.icon} tone={look.tone} />
      ) : (
        <View style={styles.quiet}>
          <Icon name={look.icon} size={16} color={colors.inkSoft} />
          <AppText variant="small" numberOfLines={2} style={styles.cellText}>
            {look.label}
          </AppText>
        </View>
      );
    },
  },
];

/** Wide screens: the same tools as a table. */
export function ToolTable({ tools }: { tools: readonly Tool[] }) {
  return (
    <DataTable
      caption="Tools"
      columns={columns}
      rows={tools}
      rowKey={(t) => t.id}
      rowHref={toolHref}
      rowLabel={(t) => `Open tool ${t.code}, ${t.name}`}
      rowTestID={(t) => `tool-row-${t.code}`}
      testID="tool-table"
    />
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
  row: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    minHeight: touch,
    padding: space.lg,
    backgroundColor: colors.card,
    borderWidth: 1,
    borderColor: colors.steelLight,
    borderRadius: radii.lg,
  },
  rowBody: { flex: 1, gap: space.xs },
  rowTop: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.sm, flexWrap: 'wrap' },
  gauge: { marginTop: space.xs, marginBottom: 2 },
  cellText: { flexShrink: 1, minWidth: 0 },
  quiet: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
});
