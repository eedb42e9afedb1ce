import { useLocalSearchParams } from 'expo-router';
import { OpenPlansCard } from '@/features/numbers/components/open-plans-card';
import { ToolDetailScreen } from '@/features/tools/screens/tool-detail-screen';

export default function ToolRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <ToolDetailScreen toolId={id} openPlans={<OpenPlansCard toolId={id} />} />;
}
