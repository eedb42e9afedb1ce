import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { formatCents } from '@shared/domain/money';
import type { RequestDetail } from '@shared/schemas/change-requests';
import type { SignOff, VerifyResult } from '@shared/schemas/sign-offs';
import { toUserMessage } from '@/api/errors';
import { AppText } from '@/components/ui/app-text';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Icon } from '@/components/ui/icon';
import { Loading } from '@/components/ui/loading';
import { Section } from '@/components/ui/section';
import { StatusPill } from '@/components/ui/status-pill';
import { formatDay } from '@/lib/requests/format';
import { useSession } from '@/lib/session';
import { colors, space, tones } from '@/theme';
import { usableZone } from '@/lib/requests/workflow-format';
import { useSignOffs, useToolCurrency, useVerify } from '../hooks';
import { decisionLook } from '@/lib/requests/workflow-look';
import { SignedTime } from './signed-time';

const targetWords: Record<string, string> = { draft: 'the designer', engineering_review: 'the tooling engineer' };

/**
 * The sign-off record of a request, oldest first: who signed, as what, what they decided, what
 * their signature said, their comment and when (in the viewer's zone; UTC on hover or press).
 * "Check record" asks the server to recompute the hash chain.
 */
export function SignOffTimeline({ request, testID = 'sign-offs' }: { request: RequestDetail; testID?: string }) {
  const session = useSession();
  const zone = usableZone(session.data?.timeZone);
  const fetched = useSignOffs(request.id, !request.signOffs);
  const list = request.signOffs ?? fetched.data?.data;
  const hasCut = !!list?.some((s) => s.details.cut);
  const currency = useToolCurrency(request.tool.id, hasCut);
  const [asked, setAsked] = useState(false);
  const verify = useVerify(request.id, asked);

  return (
    <Section
      title="Sign-offs"
      description={`Who signed what, and what they were told. Times in your zone (${zone}); press a time for UTC.`}
      testID={testID}
    >
      {!list ? (
        fetched.isError ? (
          <Banner kind="due" message={toUserMessage(fetched.error)} />
        ) : (
          <Loading label="Loading the sign-offs…" />
        )
      ) : list.length === 0 ? (
        <AppText variant="body" tone="soft" testID={`${testID}-none`}>
          No sign-offs yet. The first one is the designer's, when the request is submitted.
        </AppText>
      ) : (
        <>
          <Card padded={false}>
            {list.map((s, i) => (
              <Entry key={s.id} s={s} zone={zone} currency={currency} last={i === list.length - 1} testID={`${testID}-${s.seq}`} />
            ))}
          </Card>
          <View style={styles.check}>
            <Button
              title="Check record"
              icon="shield"
              variant="secondary"
              busy={verify.isFetching}
              busyTitle="Checking…"
              onPress={() => (asked ? void verify.refetch() : setAsked(true))}
              testID={`${testID}-verify`}
            />
            <AppText variant="small" style={styles.checkHint}>
              Checks that no sign-off, and nothing it was given for, was changed afterwards.
            </AppText>
          </View>
          {asked && verify.data && !verify.isFetching ? <VerifyBanner v={verify.data} testID={`${testID}-verify-result`} /> : null}
          {asked && verify.isError && !verify.isFetching ? (
            <Banner kind="due" title="The record could not be checked" message={toUserMessage(verify.error)} testID={`${testID}-verify-error`} />
          ) : null}
        </>
      )}
    </Section>
  );
}

function VerifyBanner({ v, testID }: { v: VerifyResult; testID: string }) {
  if (v.intact) {
    const n = v.checked;
    return (
      <Banner kind="go" icon="shield" title={`Record intact (${n} ${n === 1 ? 'sign-off' : 'sign-offs'} checked)`} testID={testID}>
        <AppText variant="body">
          Every sign-off links to the one before it and still matches what was signed.
          {v.contentMatchesLatest ? '' : ' The request was edited after the last sign-off, as this stage allows: the next signature covers the new version.'}
        </AppText>
        <CheckScope v={v} testID={`${testID}-scope`} />
      </Banner>
    );
  }
  return (
    <Banner kind="due" icon="alert" title={v.firstBrokenSeq ? `Record broken at sign-off ${v.firstBrokenSeq}` : 'Record broken'} testID={testID}>
      <AppText variant="body">{v.reason ?? 'The sign-offs do not add up.'}</AppText>
      <AppText variant="small">
        {v.checked} {v.checked === 1 ? 'sign-off holds' : 'sign-offs hold'} before it. Something was changed outside Toolgate: tell your administrator and do not rely on the later signatures.
      </AppText>
      <CheckScope v={v} testID={`${testID}-scope`} />
    </Banner>
  );
}

/** What the record check covers and when it ran. */
function CheckScope({ v, testID }: { v: VerifyResult; testID: string }) {
  if (!v.covers?.length) return null;
  const at = v.checkedAt ? new Date(v.checkedAt) : null;
  return (
    <View testID={testID} style={styles.scope}>
      <AppText variant="small">The check covers:</AppText>
      {v.covers.map((c) => (
        <AppText key={c} variant="small">
          {`• ${c}`}
        </AppText>
      ))}
      {at ? <AppText variant="small">{`Last run ${at.toISOString().slice(0, 16).replace('T', ' ')} UTC.`}</AppText> : null}
    </View>
  );
}

function Entry({ s, zone, currency, last, testID }: { s: SignOff; zone: string; currency: string; last: boolean; testID: string }) {
  const look = decisionLook[s.decision];
  const t = tones[look.tone];
  const d = s.details;
  const facts: string[] = [];
  if (d.target) facts.push(`Sent back to ${targetWords[d.target] ?? d.target}.`);
  if (d.confirmedProductIds?.length) {
    const n = d.confirmedProductIds.length;
    facts.push(`Ticked ${n === 1 ? 'the one product' : `each of the ${n} products`} the change ends.`);
  }
  if (d.confirmedBy?.length) {
    const how = d.confirmedBy.map((c) => (c === 'password' ? 'their password' : 'the typed tool code'));
    facts.push(`Confirmed with ${how.join(' and ')}.`);
  }
  return (
    <View style={[styles.entry, !last && styles.divider]} testID={testID} role="listitem">
      <View style={styles.rail}>
        <View style={[styles.dot, { backgroundColor: t.bg, borderColor: t.border }]}>
          <Icon name={look.icon} size={18} color={t.fg} strokeWidth={2} />
        </View>
        {!last ? <View style={styles.line} /> : null}
      </View>
      <View style={styles.body}>
        <View style={styles.head}>
          <StatusPill label={look.word} icon={look.icon} tone={look.tone} testID={`${testID}-decision`} />
          {!s.contentMatchesCurrent ? (
            <StatusPill label="Given for an earlier version" icon="history" tone="due" testID={`${testID}-earlier`} />
          ) : null}
          <AppText variant="monoSmall" style={styles.seq}>
            No. {s.seq}
          </AppText>
        </View>
        <AppText variant="bodyStrong" testID={`${testID}-signer`}>
          {s.signer.printedName}
          <AppText variant="small"> · {s.roleLabel}</AppText>
        </AppText>
        <AppText variant="body" testID={`${testID}-meaning`}>
          {s.isSignature ? `“${s.meaning}”` : s.meaning}
        </AppText>
        {s.comment ? (
          <View style={styles.quote}>
            <AppText variant="small" testID={`${testID}-comment`}>
              <AppText variant="label">Comment: </AppText>
              {s.comment}
            </AppText>
          </View>
        ) : null}
        {d.cut ? (
          <AppText variant="small" testID={`${testID}-cut`}>
            <AppText variant="label">Cut: </AppText>
            {formatCents(d.cut.actualCostCents, currency)} · cut on {formatDay(d.cut.cutOn)}
            {d.cut.note ? ` · ${d.cut.note}` : ''}
          </AppText>
        ) : null}
        {d.retestNote ? (
          <AppText variant="small" testID={`${testID}-retest`}>
            <AppText variant="label">Re-test note: </AppText>
            {d.retestNote}
          </AppText>
        ) : null}
        {facts.length ? (
          <AppText variant="small" testID={`${testID}-facts`}>
            {facts.join(' ')}
          </AppText>
        ) : null}
        {!s.contentMatchesCurrent ? (
          <AppText variant="small" tone="due">
            The request was edited after this sign-off: it was given for an earlier version.
          </AppText>
        ) : null}
        <SignedTime iso={s.signedAt} timeZone={zone} testID={`${testID}-time`} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  scope: { marginTop: space.sm, gap: space.xxs },
  entry: { flexDirection: 'row', gap: space.md, paddingHorizontal: space.lg, paddingTop: space.md, paddingBottom: space.xs },
  divider: { borderBottomWidth: 1, borderBottomColor: colors.steelLight },
  rail: { alignItems: 'center', width: 32 },
  dot: { width: 32, height: 32, borderRadius: 16, borderWidth: 1, alignItems: 'center', justifyContent: 'center' },
  line: { flex: 1, width: 2, backgroundColor: colors.steelLight, marginTop: space.xs, marginBottom: -space.xs },
  body: { flex: 1, gap: space.xs, minWidth: 0 },
  head: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  seq: { marginLeft: 'auto' },
  check: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.md },
  checkHint: { flex: 1, minWidth: 200 },
  quote: { borderLeftWidth: 3, borderLeftColor: colors.steelLight, paddingLeft: space.sm },
});
