import { useState } from 'react';
import { Platform, StyleSheet, View } from 'react-native';
import {
  csvColumnsOf,
  importKinds,
  requiredCsvColumns,
  type ImportKind,
  type ImportReport,
} from '@shared/schemas/registry';
import { toUserMessage } from '@/api/errors';
import { importReportOf, importTemplateUrl } from '@/api/registry';
import { AppText } from '@/components/ui/app-text';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { Loading } from '@/components/ui/loading';
import { Screen } from '@/components/ui/screen';
import { TextField } from '@/components/ui/text-field';
import { pickTextFile, startDownload } from '@/lib/download';
import { plural } from '@/lib/registry-format';
import { space } from '@/theme';
import { ImportReportView } from '../components/import-report';
import { useCanEditRegistry, useImportCsv } from '../hooks';

const kindLabels: Record<ImportKind, { label: string; hint: string }> = {
  tools: { label: 'Tools', hint: 'One row per tool, matched by code' },
  parts: { label: 'Parts', hint: 'Matched by tool code and part name' },
  products: { label: 'Products', hint: 'Matched by SKU' },
  bill: { label: 'Bill of parts', hint: 'Matched by SKU, tool code and part name' },
};
const columnsOf = csvColumnsOf;

/** Data lines in a CSV (not counting the header or blank lines); quoted line breaks are rare in these files. */
const dataLines = (csv: string) => Math.max(0, csv.split(/\r\n|\n|\r/).filter((l) => l.trim() !== '').length - 1);

type Checked = { kind: ImportKind; csv: string; report: ImportReport };

/**
 * Load tools, parts, products or the bill of parts from CSV: check every row first (nothing is
 * written), then apply them all in one go. A run with any bad row writes nothing.
 */
export function ToolImportScreen() {
  const canEdit = useCanEditRegistry();
  const run = useImportCsv();
  const [kind, setKind] = useState<ImportKind>('tools');
  const [csv, setCsv] = useState('');
  const [fileName, setFileName] = useState<string | null>(null);
  const [checked, setChecked] = useState<Checked | null>(null);
  const [applied, setApplied] = useState<ImportReport | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);

  if (!canEdit) {
    return (
      <Screen title="Import from CSV" back={{ href: '/tools', label: 'Tools' }}>
        <Banner kind="info" icon="lock" title="Only tooling engineers and administrators load data" message="Ask the tooling engineer to import the file." />
      </Screen>
    );
  }

  const lines = dataLines(csv);
  // A check counts only for the exact text and kind it was made on.
  const current = checked && checked.kind === kind && checked.csv === csv ? checked.report : null;
  const clean = !!current && current.errorRows === 0 && current.fileErrors.length === 0 && current.totalRows > 0;
  const required = new Set(requiredCsvColumns[kind]);

  const change = (text: string, name: string | null = null) => {
    setCsv(text);
    setFileName(name);
    setApplied(null);
    run.reset();
  };
  const check = () => {
    setApplied(null);
    run.mutate(
      { kind, csv, dryRun: true },
      { onSuccess: (report) => setChecked({ kind, csv, report }) },
    );
  };
  const apply = () =>
    run.mutate(
      { kind, csv, dryRun: false },
      {
        onSuccess: (report) => {
          setApplied(report);
          setChecked(null);
        },
        onError: (e) => {
          const report = importReportOf(e);
          if (report) setChecked({ kind, csv, report });
        },
      },
    );
  const choose = async () => {
    setFileError(null);
    try {
      const file = await pickTextFile('.csv,text/csv,text/plain');
      if (file) change(file.text, file.name);
    } catch {
      setFileError('That file could not be read. Save it as CSV (UTF-8) and pick it again.');
    }
  };
  const running = run.isPending ? (run.variables?.dryRun ? `Checking ${plural(lines, 'row')}…` : `Applying ${plural(lines, 'row')}…`) : null;

  return (
    <Screen eyebrow="Tools" title="Import from CSV" subtitle="Check every row first; nothing is written until you apply, and a file with any bad row writes nothing." back={{ href: '/tools', label: 'Tools' }} testID="tool-import-screen">
      <Card style={styles.group}>
        <AppText variant="heading" role="heading" aria-level={2}>
          1. What the file holds
        </AppText>
        <ChoiceGroup<ImportKind>
          label="Kind of rows"
          options={importKinds.map((k) => ({ value: k, label: kindLabels[k].label, hint: kindLabels[k].hint }))}
          value={kind}
          onChange={(k) => {
            setKind(k);
            setApplied(null);
            run.reset();
          }}
          hint="Load tools first, then parts, products and the bill of parts."
          testID="import-kind"
        />
        <View style={styles.columns}>
          <AppText variant="label">Columns (header row; * required, any order)</AppText>
          <AppText variant="monoSmall" testID="import-columns">
            {columnsOf[kind].map((c) => (required.has(c) ? `${c}*` : c)).join(', ')}
          </AppText>
          <AppText variant="small">Money as 45000.00 (no currency sign), dates as YYYY-MM-DD. An empty cell keeps the stored value.</AppText>
        </View>
        <Button title="Download a template" icon="download" variant="quiet" onPress={() => startDownload(importTemplateUrl(kind))} testID="import-template" />
      </Card>

      <Card style={styles.group}>
        <AppText variant="heading" role="heading" aria-level={2}>
          2. The file
        </AppText>
        {Platform.OS === 'web' ? (
          <View style={styles.fileRow}>
            <Button title="Choose a CSV file…" icon="file" variant="secondary" onPress={() => void choose()} disabled={run.isPending} testID="import-choose" />
            {fileName ? (
              <AppText variant="small" testID="import-file-name">
                {fileName} · {plural(lines, 'row')}
              </AppText>
            ) : null}
          </View>
        ) : null}
        {fileError ? <Banner kind="due" message={fileError} /> : null}
        <TextField
          label={Platform.OS === 'web' ? 'Or paste the CSV here' : 'Paste the CSV here'}
          multiline
          mono
          numberOfLines={8}
          autoCapitalize="none"
          autoCorrect={false}
          spellCheck={false}
          placeholder={`${columnsOf[kind].slice(0, 4).join(',')},…`}
          value={csv}
          onChangeText={(t) => change(t, fileName)}
          hint={csv ? `${plural(lines, 'data row')} after the header` : undefined}
          testID="import-csv"
        />
        <Button
          title="Check the rows"
          icon="search"
          variant={clean ? 'secondary' : 'primary'}
          onPress={check}
          disabled={!csv.trim() || run.isPending}
          busy={run.isPending && run.variables?.dryRun}
          busyTitle="Checking…"
          testID="import-check"
        />
      </Card>

      {running ? <Loading label={running} testID="import-progress" /> : null}
      {run.isError && !importReportOf(run.error) ? <Banner kind="due" title="That did not go through" message={toUserMessage(run.error)} testID="import-error" /> : null}

      {applied ? (
        <Banner kind="go" title="Imported" testID="import-applied">
          <AppText variant="body">
            {`${plural(applied.created, 'row')} created, ${applied.updated} updated, ${applied.unchanged} unchanged. Every row was written in one go.`}
          </AppText>
          <Button title="Open the tools" iconRight="arrow-right" variant="secondary" href="/tools" />
        </Banner>
      ) : null}

      {current ? (
        <Card style={styles.group}>
          <AppText variant="heading" role="heading" aria-level={2}>
            3. Check and apply
          </AppText>
          {clean ? (
            <Banner kind="go" title="Every row can be applied" message="Nothing is written yet. Apply to write all rows in one go." testID="import-clean" />
          ) : current.totalRows === 0 && current.fileErrors.length === 0 ? (
            <Banner kind="due" title="No rows to load" message="The file has a header but no data rows." />
          ) : (
            <Banner
              kind="due"
              title="Fix the problems, then check again"
              message={`Nothing has been written. Correct ${current.errorRows > 0 ? plural(current.errorRows, 'row') : 'the file'} in your file (line numbers count the header as line 1), then pick or paste it again.`}
              testID="import-has-errors"
            />
          )}
          <ImportReportView report={current} />
          <Button
            title={`Apply ${plural(current.totalRows, 'row')}`}
            icon="upload"
            onPress={apply}
            disabled={!clean || run.isPending}
            busy={run.isPending && run.variables?.dryRun === false}
            busyTitle="Applying…"
            testID="import-apply"
          />
        </Card>
      ) : checked && !applied ? (
        <Banner kind="info" message="The file or kind changed since the last check: check the rows again before applying." testID="import-recheck" />
      ) : null}
      {applied ? <ImportReportView report={applied} /> : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  group: { gap: space.sm, padding: space.xl },
  columns: { gap: space.xs },
  fileRow: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.md },
});
