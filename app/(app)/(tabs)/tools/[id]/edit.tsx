import { useLocalSearchParams } from 'expo-router';
import { ToolEditScreen } from '@/features/tools/screens/tool-edit-screen';

export default function ToolEditRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <ToolEditScreen toolId={id} />;
}
