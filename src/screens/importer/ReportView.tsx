/**
 * An import report as a region named "Import report": one sentence on the
 * outcome, the counts per kind, then every issue, errors first. A table on
 * a wide screen; on a phone one card per issue, the message first.
 */
import { StyleSheet, Text, View } from 'react-native';
import { countOf, formatCount } from '@/shared/format';
import type { ImportReport } from '@/shared/schemas/import';
import { Badge } from '@/src/components/Badge';
import { DataTable } from '@/src/components/DataTable/DataTable';
import { useBreakpoints } from '@/src/hooks/useBreakpoints';
import { colors, fonts, radius, space, type } from '@/src/theme';
import { WORDS } from '../inventory/kinds';
import { countRows, issueRows, issueTotals, reportHeadline, type IssueRow } from './report';

/** Issues drawn at most; a file with thousands of problems needs fixing at the source anyway. */
const SHOWN = 500;

const capital = (s: string) => `${s[0].toUpperCase()}${s.slice(1)}`;
const kindWord = (kind: IssueRow['kind']) => (kind === 'document' ? 'file' : WORDS[kind].one);

function SeverityBadge({ severity }: { severity: IssueRow['severity'] }) {
  return severity === 'error' ? <Badge label="error" tone="bad" shape="cross" /> : <Badge label="warning" tone="warn" shape="triangle" />;
}

export function ReportView({ report }: { report: ImportReport }) {
  const { wide } = useBreakpoints();
  const issues = issueRows(report);
  const shown = issues.slice(0, SHOWN);
  const failed = report.errors.length > 0;
  const counts = countRows(report);
  const total = issueTotals(report);
  const plural = (n: number, word: string) => countOf(n, word);

  return (
    <View role="region" aria-label="Import report" style={styles.region} testID="import-report">
      <View style={[styles.headline, failed ? styles.headlineBad : styles.headlineGood]} accessibilityLiveRegion="polite">
        <Badge label={failed ? 'cannot import' : report.dryRun ? 'ready to import' : 'imported'} tone={failed ? 'bad' : 'good'} shape={failed ? 'cross' : 'solid'} />
        <Text style={styles.headlineText} testID="import-headline">
          {reportHeadline(report)}
        </Text>
        {report.replace && !failed ? <Text style={styles.body}>{`Replace is on: records not in the file ${report.dryRun ? 'will be' : 'were'} deleted.`}</Text> : null}
      </View>

      {counts.length === 0 ? null : wide ? (
        <DataTable
          caption="Records per kind"
          rows={counts}
          rowKey={(c) => c.kind}
          columns={[
            { key: 'kind', label: 'Kind', value: (c) => capital(WORDS[c.kind].many), width: 120, sortable: false },
            { key: 'received', label: 'In file', numeric: true, value: (c) => c.received, width: 90, sortable: false },
            { key: 'created', label: report.dryRun ? 'To create' : 'Created', numeric: true, value: (c) => c.created, width: 100, sortable: false },
            { key: 'updated', label: report.dryRun ? 'To update' : 'Updated', numeric: true, value: (c) => c.updated, width: 100, sortable: false },
            { key: 'unchanged', label: 'Unchanged', numeric: true, value: (c) => c.unchanged, width: 110, sortable: false },
            { key: 'deleted', label: report.dryRun ? 'To delete' : 'Deleted', numeric: true, value: (c) => c.deleted, width: 100, sortable: false },
          ]}
          testID="import-counts"
        />
      ) : (
        <View style={styles.cards} testID="import-counts">
          {counts.map((c) => (
            <Text key={c.kind} style={styles.body}>
              <Text style={styles.kind}>{`${capital(WORDS[c.kind].many)}: `}</Text>
              {`${c.received} in file, ${c.created} ${report.dryRun ? 'to create' : 'created'}, ${c.updated} ${report.dryRun ? 'to update' : 'updated'}, ${c.unchanged} unchanged, ${c.deleted} ${report.dryRun ? 'to delete' : 'deleted'}`}
            </Text>
          ))}
        </View>
      )}

      {issues.length ? (
        <View style={styles.issues}>
          <Text style={styles.title}>{`Problems found (${plural(total.errors, 'error')}, ${plural(total.warnings, 'warning')})`}</Text>
          {wide ? (
            <DataTable
              caption="Problems found"
              rows={shown}
              rowKey={(r) => r.key}
              columns={[
                { key: 'severity', label: 'Severity', value: (r) => r.severity, render: (r) => <SeverityBadge severity={r.severity} />, width: 120, sortable: false },
                { key: 'kind', label: 'Kind', value: (r) => kindWord(r.kind), width: 80, sortable: false },
                { key: 'where', label: 'Row or item', value: (r) => r.where, width: 120, sortable: false },
                { key: 'code', label: 'Code', mono: true, value: (r) => r.code ?? '', width: 150, sortable: false },
                { key: 'field', label: 'Field', mono: true, value: (r) => r.field ?? '', width: 90, sortable: false },
                // A fixed text width: in the table's sideways scroller a long message would otherwise stay on one line.
                { key: 'message', label: 'Message', value: (r) => r.message, render: (r) => <Text style={styles.message}>{r.message}</Text>, width: 420, sortable: false },
              ]}
              testID="import-issues"
            />
          ) : (
            <View style={styles.cards} testID="import-issues">
              {shown.map((r) => (
                <View key={r.key} style={styles.card}>
                  <SeverityBadge severity={r.severity} />
                  <Text style={styles.body} selectable>
                    {r.message}
                  </Text>
                  <Text style={styles.meta}>{[kindWord(r.kind), r.where, r.code, r.field ? `field ${r.field}` : null].filter(Boolean).join(' · ')}</Text>
                </View>
              ))}
            </View>
          )}
          {issues.length > shown.length || total.unlisted > 0 ? (
            <Text style={styles.meta} testID="import-unlisted">{`Showing the first ${formatCount(shown.length)} problems, and ${formatCount(issues.length - shown.length + total.unlisted)} more.`}</Text>
          ) : null}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  region: { gap: space.lg },
  headline: { gap: space.sm, padding: space.md, borderRadius: radius.md, borderWidth: 1, borderLeftWidth: 6, backgroundColor: colors.surface },
  headlineBad: { borderColor: colors.bad },
  headlineGood: { borderColor: colors.good },
  headlineText: { ...type.body, fontFamily: fonts.textBold },
  title: { ...type.heading, fontSize: 18 },
  issues: { gap: space.sm },
  cards: { gap: space.sm },
  card: { gap: space.xs, padding: space.md, borderRadius: radius.md, borderWidth: 1, borderColor: colors.line, backgroundColor: colors.surface },
  body: { ...type.body },
  meta: { ...type.small },
  kind: { fontFamily: fonts.textBold },
  message: { ...type.body, fontSize: 16, lineHeight: 22, width: 400 },
});
