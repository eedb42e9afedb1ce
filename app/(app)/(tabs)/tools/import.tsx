import { ToolImportScreen } from '@/features/tools/screens/tool-import-screen';

export default function ToolImportRoute() {
  return <ToolImportScreen />;
}
