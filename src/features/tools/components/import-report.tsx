import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { ImportReport, ImportRow } from '@shared/schemas/registry';
import { AppText } from '@/components/ui/app-text';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import type { IconName } from '@/components/ui/icon';
import { StatusPill } from '@/components/ui/status-pill';
import { plural } from '@/lib/registry-format';
import { colors, space } from '@/theme';
import type { Tone } from '@/theme';

const actionLook: Record<ImportRow['action'], { label: string; icon: IconName; tone: Tone }> = {
  create: { label: 'New', icon: 'plus', tone: 'go' },
  update: { label: 'Update', icon: 'edit', tone: 'info' },
  unchanged: { label: 'No change', icon: 'check', tone: 'neutral' },
  error: { label: 'Problem', icon: 'alert', tone: 'due' },
};

/** Rows shown at once; the rest behind "Show all". */
const FIRST = 100;

/** The row-by-row result of a check or a run: counts, file problems, and every row's verdict. */
export function ImportReportView({ report }: { report: ImportReport }) {
  const problems = report.errorRows > 0;
  const [onlyProblems, setOnlyProblems] = useState(problems);
  const [all, setAll] = useState(false);
  const rows = onlyProblems ? report.rows.filter((r) => r.action === 'error') : report.rows;
  const shown = all ? rows : rows.slice(0, FIRST);

  return (
    <View style={styles.wrap} testID="import-report">
      <View style={styles.counts} testID="import-counts">
        <StatusPill label={report.applied ? `${report.created} created` : `${report.created} to create`} icon="plus" tone="go" testID="import-count-created" />
        <StatusPill label={report.applied ? `${report.updated} updated` : `${report.updated} to update`} icon="edit" tone="info" testID="import-count-updated" />
        <StatusPill label={`${report.unchanged} unchanged`} icon="check" tone="neutral" />
        <StatusPill label={`${plural(report.errorRows, 'row')} with problems`} icon="alert" tone={problems ? 'due' : 'neutral'} testID="import-count-errors" />
      </View>
      {report.fileErrors.length > 0 ? (
        <Banner kind="due" title="The file itself needs fixing" testID="import-file-errors">
          {report.fileErrors.map((m) => (
            <AppText key={m} variant="body">
              • {m}
            </AppText>
          ))}
        </Banner>
      ) : null}
      {report.rows.length > 0 ? (
        <Card padded={false}>
          <View style={styles.tableHead}>
            <AppText variant="label">{onlyProblems ? `Rows with problems (${rows.length})` : `All rows (${rows.length})`}</AppText>
            {problems ? (
              <Button
                title={onlyProblems ? 'Show all rows' : 'Only rows with problems'}
                variant="quiet"
                onPress={() => setOnlyProblems((v) => !v)}
                testID="import-rows-toggle"
              />
            ) : null}
          </View>
          {shown.map((r, i) => (
            <ReportRow key={`${r.line}-${r.key}`} row={r} divider={i < shown.length - 1} />
          ))}
          {rows.length > shown.length ? (
            <View style={styles.more}>
              <Button title={`Show all ${rows.length} rows`} variant="secondary" onPress={() => setAll(true)} />
            </View>
          ) : null}
        </Card>
      ) : null}
    </View>
  );
}

function ReportRow({ row, divider }: { row: ImportRow; divider: boolean }) {
  const look = actionLook[row.action];
  return (
    <View style={[styles.row, divider && styles.divider]} testID={`import-row-${row.line}`}>
      <View style={styles.rowTop}>
        <AppText variant="monoSmall" style={styles.line} accessibilityLabel={`Line ${row.line}`}>
          L{row.line}
        </AppText>
        <AppText variant="mono" style={styles.key} numberOfLines={1}>
          {row.key || '(no key)'}
        </AppText>
        <StatusPill label={look.label} icon={look.icon} tone={look.tone} />
      </View>
      {row.errors.map((e, i) => (
        <AppText key={i} variant="small" tone="due" style={styles.error}>
          {e.column ? <AppText variant="monoSmall" tone="due">{`${e.column}: `}</AppText> : null}
          {e.message}
        </AppText>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  counts: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  tableHead: {
    flexDirection: 'row',
    alignItems: 'center',
    justifyContent: 'space-between',
    flexWrap: 'wrap',
    gap: space.sm,
    paddingHorizontal: space.lg,
    paddingVertical: space.xs,
    backgroundColor: colors.steelWash,
    borderBottomWidth: 1,
    borderBottomColor: colors.steelLight,
  },
  row: { paddingHorizontal: space.lg, paddingVertical: space.sm, gap: space.xs },
  divider: { borderBottomWidth: 1, borderBottomColor: colors.steelLight },
  rowTop: { flexDirection: 'row', alignItems: 'center', gap: space.md },
  line: { width: 52 },
  key: { flex: 1 },
  error: { marginLeft: 52 + space.md },
  more: { padding: space.md, alignItems: 'center' },
});
