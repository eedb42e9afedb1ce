import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { Icon, type IconName } from '@/components/ui/icon';
import { colors, fonts, radii, space, touch } from '@/theme';

export interface SelectFilter {
  key: string;
  label: string;
  options: readonly { value: string; label: string; code?: string }[];
  value: string | undefined;
  onChange: (value: string | undefined) => void;
}

export interface ToggleFilter {
  key: string;
  label: string;
  icon: IconName;
  value: boolean;
  onChange: (value: boolean) => void;
}

export interface FilterBarProps {
  selects: readonly SelectFilter[];
  toggles?: readonly ToggleFilter[];
  onClear: () => void;
  /** Chips get `${testID}-${key}`, options `${testID}-${key}-${value}`. */
  testID?: string;
}

const ANY = '__any';

/**
 * A row of filter chips. A select chip opens its choices underneath (one at a time); a toggle chip
 * switches on and off. A chip that filters says so in words ("Brand: Mudlark Racers") and with a
 * heavier border, never by colour alone.
 */
export function FilterBar({ selects, toggles = [], onClear, testID = 'filters' }: FilterBarProps) {
  const [open, setOpen] = useState<string | null>(null);
  const active = selects.filter((s) => s.value !== undefined).length + toggles.filter((t) => t.value).length;
  const openSelect = selects.find((s) => s.key === open);

  return (
    <View style={styles.wrap} testID={testID}>
      <View style={styles.row} role="toolbar" accessibilityLabel="Filters">
        <Icon name="filter" size={18} color={colors.inkSoft} />
        {selects.map((s) => {
          const picked = s.options.find((o) => o.value === s.value);
          const isOpen = open === s.key;
          return (
            <Pressable
              key={s.key}
              role="button"
              aria-expanded={isOpen}
              accessibilityLabel={picked ? `${s.label}: ${picked.label}. Change` : `Filter by ${s.label.toLowerCase()}`}
              onPress={() => setOpen(isOpen ? null : s.key)}
              testID={`${testID}-${s.key}`}
              style={({ pressed }) => [styles.chip, picked && styles.chipOn, isOpen && styles.chipOpen, pressed && styles.pressed]}
            >
              <AppText variant="label" style={picked ? styles.labelOn : undefined} numberOfLines={1}>
                {picked ? `${s.label}: ${picked.label}` : s.label}
              </AppText>
              <Icon name={isOpen ? 'close' : 'chevron-down'} size={16} color={colors.inkSoft} />
            </Pressable>
          );
        })}
        {toggles.map((t) => (
          <Pressable
            key={t.key}
            role="checkbox"
            aria-checked={t.value}
            accessibilityLabel={t.label}
            onPress={() => t.onChange(!t.value)}
            testID={`${testID}-${t.key}`}
            style={({ pressed }) => [styles.chip, t.value && styles.chipOn, pressed && styles.pressed]}
          >
            <View style={[styles.box, t.value && styles.boxOn]}>{t.value ? <Icon name="check" size={12} color={colors.onColour} strokeWidth={3} /> : null}</View>
            <Icon name={t.icon} size={16} color={colors.inkSoft} />
            <AppText variant="label" style={t.value ? styles.labelOn : undefined} numberOfLines={1}>
              {t.label}
            </AppText>
          </Pressable>
        ))}
        {active > 0 ? <Button title="Clear filters" variant="quiet" onPress={() => { setOpen(null); onClear(); }} testID={`${testID}-clear`} /> : null}
      </View>
      {openSelect ? (
        <View style={styles.panel} testID={`${testID}-${openSelect.key}-panel`}>
          <ChoiceGroup<string>
            label={openSelect.label}
            options={[{ value: ANY, label: `Any ${openSelect.label.toLowerCase()}` }, ...openSelect.options]}
            value={openSelect.value ?? ANY}
            onChange={(v) => {
              openSelect.onChange(v === ANY ? undefined : v);
              setOpen(null);
            }}
            testID={`${testID}-${openSelect.key}`}
          />
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  row: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  chip: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.xs,
    minHeight: touch,
    paddingHorizontal: space.md,
    borderRadius: radii.pill,
    borderWidth: 1,
    borderColor: colors.steel,
    backgroundColor: colors.card,
    maxWidth: '100%',
  },
  chipOn: { borderColor: colors.ink, borderWidth: 2, paddingHorizontal: space.md - 1, backgroundColor: colors.steelWash },
  chipOpen: { borderColor: colors.ink },
  pressed: { backgroundColor: colors.steelWash },
  labelOn: { fontFamily: fonts.sansSemiBold },
  box: { width: 16, height: 16, borderRadius: 3, borderWidth: 1.5, borderColor: colors.steel, alignItems: 'center', justifyContent: 'center' },
  boxOn: { backgroundColor: colors.ink, borderColor: colors.ink },
  panel: {
    backgroundColor: colors.card,
    borderWidth: 1,
    borderColor: colors.steelLight,
    borderRadius: radii.lg,
    paddingHorizontal: space.lg,
    paddingTop: space.md,
  },
});
