import type { BottomTabNavigationOptions } from 'expo-router/tabs';
import { View } from 'react-native';
import { Wordmark } from '@/components/wordmark';
import { Icon, type IconName } from '@/components/ui/icon';
import { colors, fonts, layout, space } from '@/theme';
import { useWide } from '@/theme/use-wide';

/** The five main tabs, in order. Each is a folder in app/(app)/(tabs)/ with its own stack. */
export const mainTabs: readonly { name: string; title: string; icon: IconName }[] = [
  { name: 'inbox', title: 'Inbox', icon: 'inbox' },
  { name: 'requests', title: 'Requests', icon: 'requests' },
  { name: 'tools', title: 'Tools', icon: 'tool' },
  { name: 'products', title: 'Products', icon: 'product' },
  { name: 'me', title: 'Me', icon: 'person' },
];

export function tabOptions(tab: (typeof mainTabs)[number]): BottomTabNavigationOptions {
  return {
    title: tab.title,
    tabBarIcon: ({ color, focused }) => <Icon name={tab.icon} size={24} color={String(color)} strokeWidth={focused ? 2.2 : 1.8} />,
    tabBarButtonTestID: `tab-${tab.name}`,
    tabBarAccessibilityLabel: tab.title,
  };
}

/** Bottom tabs on phones; a side rail at >= 1024 px. */
export function useTabScreenOptions(): BottomTabNavigationOptions {
  const wide = useWide();
  return {
    headerShown: false,
    tabBarPosition: wide ? 'left' : 'bottom',
    tabBarLabelPosition: wide ? 'beside-icon' : 'below-icon',
    tabBarActiveTintColor: colors.ink,
    tabBarInactiveTintColor: colors.inkSoft,
    // Without an active background the rail loses the selected label.
    tabBarActiveBackgroundColor: colors.steelWash,
    tabBarInactiveBackgroundColor: colors.card,
    tabBarLabelStyle: wide
      ? { fontFamily: fonts.sansMedium, fontSize: 15, marginLeft: space.md }
      : { fontFamily: fonts.sansMedium, fontSize: 12, marginTop: 2 },
    tabBarItemStyle: wide
      ? { minHeight: 48, borderRadius: 8, marginHorizontal: space.sm, marginVertical: 2, justifyContent: 'flex-start', paddingHorizontal: space.md }
      : { minHeight: 56, paddingVertical: 4 },
    tabBarStyle: wide
      ? {
          width: layout.railWidth,
          minWidth: layout.railWidth,
          backgroundColor: colors.card,
          borderRightWidth: 1,
          borderRightColor: colors.steelLight,
          paddingTop: 96,
          paddingStart: 0,
          paddingEnd: 0,
        }
      : { minHeight: 64, backgroundColor: colors.card, borderTopWidth: 1, borderTopColor: colors.steelLight },
    // The rail carries the product's name above the tabs (drawn behind them, so it takes no taps).
    tabBarBackground: wide ? RailHeader : undefined,
    sceneStyle: { backgroundColor: colors.paper },
  };
}

function RailHeader() {
  return (
    <View style={{ paddingHorizontal: space.xl, paddingTop: space.xl }}>
      <Wordmark small />
    </View>
  );
}
