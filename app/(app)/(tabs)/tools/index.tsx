import { ToolListScreen } from '@/features/tools/screens/tool-list-screen';

export default function ToolsRoute() {
  return <ToolListScreen />;
}
