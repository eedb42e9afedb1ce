import { useState } from 'react';
import { Image, Platform, Pressable, StyleSheet, View, type GestureResponderEvent, type LayoutChangeEvent } from 'react-native';
import type { ImageRole } from '@shared/schemas/change-items';
import { AppText } from '@/components/ui/app-text';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { Icon } from '@/components/ui/icon';
import { colors, fonts, radii, space, touch } from '@/theme';
import { RegionMark, type MarkBox } from './region-mark';

export interface CompareImage {
  uri: string;
  width: number | null;
  height: number | null;
  name: string;
}

export interface CompareMark {
  role: ImageRole;
  mark: MarkBox;
  /** The item number shown on the mark. */
  label: string;
}

type Mode = 'side' | 'overlay';

const ratioOf = (img: CompareImage | null) => (img?.width && img.height ? img.width / img.height : 4 / 3);
const clamp = (v: number) => Math.max(0, Math.min(1, v));

/**
 * Before and after, side by side or overlaid with a slider that reveals the after image over the
 * before one. Item marks are drawn on the image they belong to.
 */
export function ImageCompare({ before, after, marks, testID = 'image-compare' }: { before: CompareImage | null; after: CompareImage | null; marks: readonly CompareMark[]; testID?: string }) {
  const [mode, setMode] = useState<Mode>('side');
  const both = !!before && !!after;
  return (
    <View style={styles.wrap} testID={testID}>
      {both ? (
        <ChoiceGroup<Mode>
          label="Compare"
          options={[
            { value: 'side', label: 'Side by side' },
            { value: 'overlay', label: 'Overlay with slider' },
          ]}
          value={mode}
          onChange={setMode}
          testID={`${testID}-mode`}
        />
      ) : null}
      {both && mode === 'overlay' ? (
        <Overlay before={before} after={after} marks={marks} testID={`${testID}-overlay`} />
      ) : (
        <View style={styles.side}>
          <Pane role="before" img={before} marks={marks} testID={`${testID}-before`} />
          <Pane role="after" img={after} marks={marks} testID={`${testID}-after`} />
        </View>
      )}
    </View>
  );
}

function RoleLabel({ role }: { role: ImageRole }) {
  return (
    <View style={styles.roleLabel}>
      <Icon name={role === 'before' ? 'image' : 'edit'} size={16} color={colors.inkSoft} />
      <AppText variant="label">{role === 'before' ? 'Before' : 'After'}</AppText>
    </View>
  );
}

function Pane({ role, img, marks, testID }: { role: ImageRole; img: CompareImage | null; marks: readonly CompareMark[]; testID: string }) {
  return (
    <View style={styles.pane}>
      <RoleLabel role={role} />
      {img ? (
        <View style={[styles.frame, { aspectRatio: ratioOf(img) }]} testID={testID}>
          <Image source={{ uri: img.uri }} style={styles.fill} resizeMode="stretch" accessibilityLabel={`${role === 'before' ? 'Before' : 'After'} image: ${img.name}`} />
          {marks
            .filter((m) => m.role === role)
            .map((m) => (
              <RegionMark key={`${m.label}-${m.role}`} mark={m.mark} label={m.label} testID={`${testID}-mark-${m.label}`} />
            ))}
        </View>
      ) : (
        <View style={[styles.frame, styles.missing]} testID={`${testID}-missing`}>
          <Icon name="image" size={28} color={colors.steel} />
          <AppText variant="small" align="center">
            No {role} image yet
          </AppText>
        </View>
      )}
    </View>
  );
}

function Overlay({ before, after, marks, testID }: { before: CompareImage; after: CompareImage; marks: readonly CompareMark[]; testID: string }) {
  const [reveal, setReveal] = useState(0.5);
  const [width, setWidth] = useState(0);
  const onLayout = (e: LayoutChangeEvent) => setWidth(e.nativeEvent.layout.width);
  const follow = (e: GestureResponderEvent) => {
    if (width > 0) setReveal(clamp(e.nativeEvent.locationX / width));
  };
  const [trackWidth, setTrackWidth] = useState(0);
  const followTrack = (e: GestureResponderEvent) => {
    if (trackWidth > 0) setReveal(clamp(e.nativeEvent.locationX / trackWidth));
  };
  const percent = Math.round(reveal * 100);
  const step = (d: number) => setReveal((r) => clamp(Math.round((r + d) * 10) / 10));
  return (
    <View style={styles.overlayWrap}>
      <View
        style={[styles.frame, { aspectRatio: ratioOf(before) }, Platform.OS === 'web' ? ({ touchAction: 'none', cursor: 'ew-resize' } as object) : null]}
        onLayout={onLayout}
        onStartShouldSetResponder={() => true}
        onMoveShouldSetResponder={() => true}
        onResponderTerminationRequest={() => false}
        onResponderGrant={follow}
        onResponderMove={follow}
        testID={testID}
      >
        <View pointerEvents="none" style={styles.fill}>
          <Image source={{ uri: before.uri }} style={styles.fill} resizeMode="stretch" accessibilityLabel={`Before image: ${before.name}`} />
          <View style={[styles.clip, { width: `${reveal * 100}%` }]} testID={`${testID}-after-layer`}>
            <Image
              source={{ uri: after.uri }}
              style={{ width: width || '100%', height: '100%' } as object}
              resizeMode="stretch"
              accessibilityLabel={`After image: ${after.name}`}
            />
          </View>
          {marks.map((m) => (
            <RegionMark key={`${m.label}-${m.role}`} mark={m.mark} label={m.label} />
          ))}
          <View style={[styles.divider, { left: `${reveal * 100}%` }]}>
            <View style={styles.knob}>
              <Icon name="compare" size={16} color={colors.ink} />
            </View>
          </View>
          <View style={[styles.corner, styles.cornerLeft]}>
            <AppText style={styles.cornerText}>After</AppText>
          </View>
          <View style={[styles.corner, styles.cornerRight]}>
            <AppText style={styles.cornerText}>Before</AppText>
          </View>
        </View>
      </View>
      <View style={styles.controls}>
        <StepButton label="Show less of the after image" icon="chevron-left" onPress={() => step(-0.1)} testID={`${testID}-less`} />
        <View
          style={styles.trackHit}
          onLayout={(e) => setTrackWidth(e.nativeEvent.layout.width)}
          onStartShouldSetResponder={() => true}
          onMoveShouldSetResponder={() => true}
          onResponderTerminationRequest={() => false}
          onResponderGrant={followTrack}
          onResponderMove={followTrack}
          role="slider"
          aria-valuemin={0}
          aria-valuemax={100}
          aria-valuenow={percent}
          accessibilityLabel="After image revealed"
          accessibilityActions={[{ name: 'increment' }, { name: 'decrement' }]}
          onAccessibilityAction={(e) => step(e.nativeEvent.actionName === 'increment' ? 0.1 : -0.1)}
          testID={`${testID}-slider`}
        >
          <View pointerEvents="none" style={styles.track}>
            <View style={[styles.trackFill, { width: `${percent}%` }]} />
          </View>
        </View>
        <StepButton label="Show more of the after image" icon="chevron-right" onPress={() => step(0.1)} testID={`${testID}-more`} />
      </View>
      <AppText variant="small" align="center" testID={`${testID}-value`}>
        After image shown over {percent} % of the width. Drag across the picture to move the line.
      </AppText>
    </View>
  );
}

function StepButton({ label, icon, onPress, testID }: { label: string; icon: 'chevron-left' | 'chevron-right'; onPress: () => void; testID: string }) {
  return (
    <Pressable
      role="button"
      accessibilityLabel={label}
      onPress={onPress}
      style={({ pressed }) => [styles.step, pressed && { backgroundColor: colors.steelWash }]}
      testID={testID}
    >
      <Icon name={icon} size={20} color={colors.ink} />
    </Pressable>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  side: { flexDirection: 'row', gap: space.sm },
  pane: { flex: 1, gap: space.xs, minWidth: 0 },
  roleLabel: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  frame: {
    width: '100%',
    backgroundColor: colors.steelWash,
    borderRadius: radii.md,
    borderWidth: 1,
    borderColor: colors.steelLight,
    overflow: 'visible',
  },
  missing: { aspectRatio: 4 / 3, alignItems: 'center', justifyContent: 'center', gap: space.xs, padding: space.sm, borderStyle: 'dashed', borderColor: colors.steel },
  fill: { ...StyleSheet.absoluteFill, width: '100%', height: '100%' },
  overlayWrap: { gap: space.sm, width: '100%', maxWidth: 720, alignSelf: 'center' },
  clip: { position: 'absolute', left: 0, top: 0, bottom: 0, overflow: 'hidden' },
  divider: {
    position: 'absolute',
    top: 0,
    bottom: 0,
    width: 5,
    marginLeft: -2.5,
    backgroundColor: colors.onColour,
    borderLeftWidth: 1,
    borderRightWidth: 1,
    borderColor: colors.ink,
    alignItems: 'center',
    justifyContent: 'center',
  },
  knob: {
    width: 32,
    height: 32,
    borderRadius: 16,
    backgroundColor: colors.card,
    borderWidth: 2,
    borderColor: colors.ink,
    alignItems: 'center',
    justifyContent: 'center',
  },
  corner: { position: 'absolute', top: space.sm, paddingHorizontal: space.sm, paddingVertical: 2, borderRadius: radii.sm, backgroundColor: 'rgba(23,33,43,0.78)' },
  cornerLeft: { left: space.sm },
  cornerRight: { right: space.sm },
  cornerText: { color: colors.onColour, fontFamily: fonts.sansMedium, fontSize: 12, lineHeight: 16 },
  controls: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  trackHit: { flex: 1, height: touch, justifyContent: 'center' },
  track: { height: 8, borderRadius: 4, backgroundColor: colors.steelLight, overflow: 'hidden' },
  trackFill: { height: '100%', backgroundColor: colors.ink },
  step: {
    width: touch,
    height: touch,
    borderRadius: radii.md,
    borderWidth: 1,
    borderColor: colors.steel,
    backgroundColor: colors.card,
    alignItems: 'center',
    justifyContent: 'center',
  },
});
