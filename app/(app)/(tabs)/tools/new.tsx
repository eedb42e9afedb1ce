import { ToolCreateScreen } from '@/features/tools/screens/tool-edit-screen';

export default function NewToolRoute() {
  return <ToolCreateScreen />;
}
