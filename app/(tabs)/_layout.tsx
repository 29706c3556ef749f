import { AppShell } from '@/components/shell/app-shell';

export default function TabsLayout() {
  return <AppShell />;
}
