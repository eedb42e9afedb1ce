import { useEffect, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { isApiError } from '@/api/errors';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { Section } from '@/components/ui/section';
import { useSession } from '@/lib/session';
import { space } from '@/theme';
import { useRequestNumbers } from '../hooks';
import { EstimateForm } from './estimate-form';
import { NumbersCard } from './numbers-card';

export interface RequestNumbersSectionProps {
  requestId: string;
  /** The request's version as the host screen has it: when it moves on (items, derivative or stage changed), the figures are fetched again. */
  version?: number;
  /** Leave out the section title (when the host screen gives its own). */
  bare?: boolean;
  testID?: string;
}

/**
 * The numbers behind a change on the request detail (and the brand lead's approve screen): the
 * card for everyone who may see the figures, and for the tooling engineer during engineering
 * review the estimate form, whose figures follow every keystroke. Toolmakers do not see prices and
 * margins: nothing renders for them.
 */
export function RequestNumbersSection({ requestId, version, bare, testID = 'request-numbers' }: RequestNumbersSectionProps) {
  const session = useSession();
  const role = session.data?.role;
  const allowed = !!role && role !== 'toolmaker';
  const q = useRequestNumbers(requestId, allowed);
  const [editing, setEditing] = useState(false);
  const seen = q.data?.version;
  const { refetch } = q;
  useEffect(() => {
    if (version !== undefined && seen !== undefined && version !== seen) void refetch();
  }, [version, seen, refetch]);
  if (!allowed) return null;
  if (q.isError && isApiError(q.error) && q.error.status === 403) return null;

  let body;
  if (q.isPending) body = <Loading label="Loading the numbers…" testID={`${testID}-loading`} />;
  else if (q.isError) body = <ErrorState error={q.error} onRetry={() => void q.refetch()} testID={`${testID}-error`} />;
  else if (editing && q.data.canEdit) body = <EstimateForm numbers={q.data} onDone={() => setEditing(false)} />;
  else {
    const n = q.data;
    const entered = n.result.estimate.modificationCostCents !== null;
    body = (
      <NumbersCard
        result={n.result}
        facts={n.facts}
        testID="numbers-card"
        footer={
          n.canEdit ? (
            <View style={styles.footer}>
              <Button
                title={entered ? 'Change the estimate and plan' : 'Enter the estimate and plan'}
                icon="edit"
                variant={entered ? 'secondary' : 'primary'}
                onPress={() => setEditing(true)}
                testID={`${testID}-edit`}
              />
            </View>
          ) : n.readOnlyReason ? (
            <AppText variant="small" testID={`${testID}-read-only`}>
              {n.readOnlyReason}
            </AppText>
          ) : null
        }
      />
    );
  }
  if (bare) return <View testID={testID}>{body}</View>;
  return (
    <Section title="The numbers" description="What the cut costs, what each unit carries, when it pays back and whether the tool lasts." testID={testID}>
      {body}
    </Section>
  );
}

const styles = StyleSheet.create({
  footer: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
