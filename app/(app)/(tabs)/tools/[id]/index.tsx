import { useLocalSearchParams } from 'expo-router';
import { ToolDetailScreen } from '@/features/tools/screens/tool-detail-screen';

export default function ToolRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <ToolDetailScreen toolId={id} />;
}
