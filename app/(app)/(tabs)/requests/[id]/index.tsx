import { useLocalSearchParams } from 'expo-router';
import { RequestNumbersSection } from '@/features/numbers/components/request-numbers-section';
import { RequestImages } from '@/features/requests/components/request-images';
import { RequestDetailScreen } from '@/features/requests/screens/request-detail-screen';
import { WorkflowPanel } from '@/features/workflow/components/workflow-panel';

export default function RequestRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <RequestDetailScreen
      requestId={id}
      renderActions={(r) => <WorkflowPanel request={r} renderImages={(p) => <RequestImages {...p} />} />}
      renderNumbers={(r) => <RequestNumbersSection requestId={r.id} version={r.version} />}
    />
  );
}
