import { isApiError } from '@/api/errors';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { Section } from '@/components/ui/section';
import { useRequestNumbers } from '../hooks';
import { NumbersCard } from './numbers-card';

/** The numbers behind the change (cost, per unit, payback, tool life), compact, beside the brand lead's sign-off form. */
export function SignNumbersSection({ requestId }: { requestId: string }) {
  const q = useRequestNumbers(requestId);
  if (q.isError) return isApiError(q.error) && q.error.status === 403 ? null : <ErrorState error={q.error} onRetry={() => void q.refetch()} testID="sign-numbers-error" />;
  return (
    <Section title="The numbers" description="What the cut costs, what each unit carries, when it pays back and whether the tool lasts." testID="sign-numbers">
      {q.isPending ? <Loading label="Loading the numbers…" /> : <NumbersCard result={q.data.result} facts={q.data.facts} compact testID="numbers-card" />}
    </Section>
  );
}
