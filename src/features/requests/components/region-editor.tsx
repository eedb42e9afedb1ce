import { useState } from 'react';
import { Image, Platform, StyleSheet, View, type GestureResponderEvent, type LayoutChangeEvent } from 'react-native';
import { imageRoleLabels, imageRoles, markShapeLabels, markShapes, type ImageRole, type MarkShape } from '@shared/schemas/change-items';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { TextField } from '@/components/ui/text-field';
import { colors, radii, space } from '@/theme';
import { fromPercent, toPercent, type RegionFormValues } from '../forms';
import type { CompareImage } from './image-compare';
import { RegionMark, type MarkBox } from './region-mark';

type RegionErrors = Partial<Record<'x' | 'y' | 'w' | 'h', string>>;

const clamp = (v: number) => Math.max(0, Math.min(1, v));
/** A tap (no drag) places a box this big, centred on the tap. */
const TAP_SIZE = 0.2;

function toBox(r: RegionFormValues): MarkBox | null {
  const [x, y, w, h] = [r.x, r.y, r.w, r.h].map(fromPercent) as [number, number, number, number];
  if (![x, y, w, h].every(Number.isFinite) || w <= 0 || h <= 0) return null;
  return { shape: r.shape, x, y, w, h };
}

/**
 * Places a box or circle on the before or after image: drag across the picture (or tap to drop a
 * box there), or type the edges as percentages of the image. Stored as fractions, so the mark
 * fits any displayed size.
 */
export function RegionEditor({
  value,
  onChange,
  images,
  errors,
  label,
  disabled,
  testID,
}: {
  value: RegionFormValues | null;
  onChange: (r: RegionFormValues | null) => void;
  images: Record<ImageRole, CompareImage | null>;
  errors?: RegionErrors;
  label: string;
  disabled?: boolean;
  testID: string;
}) {
  if (!value) {
    return (
      <View style={styles.wrap}>
        <AppText variant="label">Where on the image</AppText>
        <AppText variant="small">Optional: mark the spot so the toolmaker sees exactly where the change goes.</AppText>
        {!disabled ? (
          <Button
            title="Mark a region on the image"
            icon="mark-box"
            variant="secondary"
            onPress={() => onChange({ imageRole: images.after || !images.before ? 'after' : 'before', shape: 'box', x: '35', y: '35', w: '30', h: '30' })}
            testID={`${testID}-add`}
          />
        ) : null}
      </View>
    );
  }
  const set = (change: Partial<RegionFormValues>) => onChange({ ...value, ...change });
  return (
    <View style={styles.wrap} testID={testID}>
      <AppText variant="label">Where on the image</AppText>
      <View style={styles.choices}>
        <ChoiceGroup<ImageRole>
          label="Image"
          options={imageRoles.map((r) => ({ value: r, label: imageRoleLabels[r] }))}
          value={value.imageRole}
          onChange={(imageRole) => set({ imageRole })}
          disabled={disabled}
          testID={`${testID}-role`}
        />
        <ChoiceGroup<MarkShape>
          label="Shape"
          options={markShapes.map((s) => ({ value: s, label: markShapeLabels[s] }))}
          value={value.shape}
          onChange={(shape) => set({ shape })}
          disabled={disabled}
          testID={`${testID}-shape`}
        />
      </View>
      <DrawSurface image={images[value.imageRole]} role={value.imageRole} value={value} onDraw={set} label={label} disabled={disabled} testID={`${testID}-surface`} />
      <View style={styles.grid}>
        {(
          [
            ['x', 'Left edge %'],
            ['y', 'Top edge %'],
            ['w', 'Width %'],
            ['h', 'Height %'],
          ] as const
        ).map(([k, text]) => (
          <View key={k} style={styles.cell}>
            <TextField
              label={text}
              value={value[k]}
              onChangeText={(v) => set({ [k]: v })}
              keyboardType="decimal-pad"
              mono
              disabled={disabled}
              error={errors?.[k]}
              testID={`${testID}-${k}`}
            />
          </View>
        ))}
      </View>
      {!disabled ? <Button title="Remove the mark" variant="quiet" icon="close" onPress={() => onChange(null)} testID={`${testID}-remove`} /> : null}
    </View>
  );
}

function DrawSurface({
  image,
  role,
  value,
  onDraw,
  label,
  disabled,
  testID,
}: {
  image: CompareImage | null;
  role: ImageRole;
  value: RegionFormValues;
  onDraw: (r: Partial<RegionFormValues>) => void;
  label: string;
  disabled?: boolean;
  testID: string;
}) {
  const [size, setSize] = useState({ w: 0, h: 0 });
  const [start, setStart] = useState<{ x: number; y: number } | null>(null);
  const [live, setLive] = useState<MarkBox | null>(null);
  const onLayout = (e: LayoutChangeEvent) => setSize({ w: e.nativeEvent.layout.width, h: e.nativeEvent.layout.height });
  const at = (e: GestureResponderEvent) => ({ x: clamp(e.nativeEvent.locationX / (size.w || 1)), y: clamp(e.nativeEvent.locationY / (size.h || 1)) });
  const rect = (a: { x: number; y: number }, b: { x: number; y: number }): MarkBox => ({
    shape: value.shape,
    x: Math.min(a.x, b.x),
    y: Math.min(a.y, b.y),
    w: Math.abs(a.x - b.x),
    h: Math.abs(a.y - b.y),
  });
  const commit = (m: MarkBox) => onDraw({ x: toPercent(m.x), y: toPercent(m.y), w: toPercent(m.w), h: toPercent(m.h) });
  const ratio = image?.width && image.height ? image.width / image.height : 4 / 3;
  const shown = live ?? toBox(value);
  return (
    <View style={styles.surfaceWrap}>
      <View
        style={[styles.surface, { aspectRatio: ratio }, Platform.OS === 'web' && !disabled ? ({ touchAction: 'none', cursor: 'crosshair' } as object) : null]}
        onLayout={onLayout}
        onStartShouldSetResponder={() => !disabled}
        onMoveShouldSetResponder={() => !disabled}
        onResponderTerminationRequest={() => false}
        onResponderGrant={(e) => {
          const p = at(e);
          setStart(p);
          setLive(null);
        }}
        onResponderMove={(e) => {
          if (start) setLive(rect(start, at(e)));
        }}
        onResponderRelease={(e) => {
          if (!start) return;
          const m = rect(start, at(e));
          if (m.w < 0.02 || m.h < 0.02) {
            // A tap: a box of the default size centred there, kept inside the image.
            commit({ shape: value.shape, x: Math.min(clamp(start.x - TAP_SIZE / 2), 1 - TAP_SIZE), y: Math.min(clamp(start.y - TAP_SIZE / 2), 1 - TAP_SIZE), w: TAP_SIZE, h: TAP_SIZE });
          } else {
            commit(m);
          }
          setStart(null);
          setLive(null);
        }}
        testID={testID}
        accessibilityLabel={`Drawing area on the ${role} image: drag to mark a region`}
      >
        <View pointerEvents="none" style={StyleSheet.absoluteFill}>
          {image ? <Image source={{ uri: image.uri }} style={styles.fill} resizeMode="stretch" /> : null}
          {!image ? (
            <View style={styles.noImage}>
              <AppText variant="small" align="center">
                No {role} image yet. The mark is kept and drawn once the image is added.
              </AppText>
            </View>
          ) : null}
          {shown ? <RegionMark mark={shown} label={label} /> : null}
        </View>
      </View>
      {!disabled ? (
        <AppText variant="small" tone="faint">
          Drag across the picture to draw the {value.shape === 'box' ? 'box' : 'circle'}, or tap to place it; fine-tune with the numbers.
        </AppText>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  choices: { gap: 0 },
  surfaceWrap: { gap: space.xs },
  surface: {
    width: '100%',
    maxWidth: 480,
    borderRadius: radii.md,
    borderWidth: 1,
    borderColor: colors.steel,
    backgroundColor: colors.steelWash,
  },
  fill: { width: '100%', height: '100%' },
  noImage: { ...StyleSheet.absoluteFill, alignItems: 'center', justifyContent: 'center', padding: space.lg },
  grid: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.sm },
  cell: { flexBasis: '45%', flexGrow: 1, minWidth: 120 },
});
