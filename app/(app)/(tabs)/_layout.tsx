import { Tabs } from 'expo-router';
import { mainTabs, tabOptions, useTabScreenOptions } from '@/components/navigation/tabs';

/** Bottom tabs on phones, a side rail at >= 1024 px. `admin` is reached from Me, not from the bar. */
export default function TabsLayout() {
  const screenOptions = useTabScreenOptions();
  return (
    <Tabs screenOptions={screenOptions}>
      {mainTabs.map((tab) => (
        <Tabs.Screen key={tab.name} name={tab.name} options={tabOptions(tab)} />
      ))}
      <Tabs.Screen name="admin" options={{ href: null, title: 'Administration' }} />
    </Tabs>
  );
}
