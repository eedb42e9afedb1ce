import { useState } from 'react';
import { ActivityIndicator, Pressable, StyleSheet, View } from 'react-native';
import { productStatusLabels } from '@shared/schemas/registry';
import { toUserMessage } from '@/api/errors';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Icon } from '@/components/ui/icon';
import { TextField } from '@/components/ui/text-field';
import { colors, fonts, radii, space, touch } from '@/theme';
import type { ProductChoice, ToolChoice } from '../forms';
import { useDebounced, useProductSearch, useToolSearch } from '../hooks';

function FieldError({ error, testID }: { error?: string; testID?: string }) {
  // The slot is kept when empty, as in TextField, so nothing jumps when a message appears.
  if (!error) return <View style={styles.slot} />;
  return (
    <View style={styles.errorRow} role="alert">
      <Icon name="alert" size={16} color={colors.due} />
      <AppText variant="small" tone="due" style={styles.errorText} testID={testID}>
        {error}
      </AppText>
    </View>
  );
}

function Chosen({ code, name, detail, onChange, changeLabel, disabled, testID }: { code: string; name: string; detail?: string; onChange?: () => void; changeLabel: string; disabled?: boolean; testID: string }) {
  return (
    <View style={[styles.chosen, disabled && styles.chosenLocked]} testID={testID}>
      <View style={styles.chosenText}>
        <AppText variant="monoStrong">{code}</AppText>
        <AppText variant="bodyStrong">{name}</AppText>
        {detail ? <AppText variant="small">{detail}</AppText> : null}
      </View>
      {onChange && !disabled ? <Button title={changeLabel} variant="quiet" onPress={onChange} testID={`${testID}-change`} /> : null}
    </View>
  );
}

function Option({ code, name, detail, onPress, disabled, testID }: { code: string; name: string; detail: string; onPress: () => void; disabled?: boolean; testID: string }) {
  return (
    <Pressable
      role="button"
      onPress={onPress}
      disabled={disabled}
      accessibilityLabel={`${code} ${name}`}
      style={({ pressed }) => [styles.option, pressed && styles.optionPressed, disabled && styles.optionDisabled]}
      testID={testID}
    >
      <View style={styles.chosenText}>
        <View style={styles.optionHead}>
          <AppText variant="monoStrong">{code}</AppText>
          <AppText variant="bodyStrong" style={styles.shrink}>
            {name}
          </AppText>
        </View>
        <AppText variant="small">{detail}</AppText>
      </View>
      {!disabled ? <Icon name="chevron-right" size={18} color={colors.steel} /> : null}
    </Pressable>
  );
}

/** Find the tool by code, name, part or product, and pick it. Locked once the request exists. */
export function ToolPicker({
  value,
  onChange,
  locked,
  error,
  testID = 'request-tool',
}: {
  value: ToolChoice | null;
  onChange: (t: ToolChoice) => void;
  locked?: boolean;
  error?: string;
  testID?: string;
}) {
  const [open, setOpen] = useState(!value);
  const [text, setText] = useState('');
  const q = useDebounced(text.trim(), 250);
  const tools = useToolSearch(q);
  const showList = (open || !value) && !locked;
  return (
    <View style={styles.field}>
      <AppText variant="label">Tool</AppText>
      {value && !showList ? (
        <Chosen
          code={value.code}
          name={value.name}
          detail={locked ? 'The tool of a request cannot change; write a new request for another tool.' : undefined}
          changeLabel="Change tool"
          onChange={() => setOpen(true)}
          disabled={locked}
          testID={`${testID}-chosen`}
        />
      ) : null}
      {showList ? (
        <View style={styles.search}>
          <TextField
            label="Find the tool"
            placeholder="Tool code, tool name, part or product"
            value={text}
            onChangeText={setText}
            leadingIcon="search"
            autoCapitalize="none"
            autoCorrect={false}
            testID={`${testID}-search`}
          />
          <View style={styles.results} testID={`${testID}-results`}>
            {tools.isPending ? (
              <ActivityIndicator color={colors.inkSoft} style={styles.note} />
            ) : tools.isError ? (
              <AppText variant="small" tone="due" style={styles.note}>
                {toUserMessage(tools.error)}
              </AppText>
            ) : tools.data.length === 0 ? (
              <AppText variant="small" style={styles.note}>
                No tool matches “{q}”. Try the code printed on the tool, such as KB-T-0412.
              </AppText>
            ) : (
              tools.data.map((t) => (
                <Option
                  key={t.id}
                  code={t.code}
                  name={t.name}
                  detail={t.readOnly ? 'Disposed: cannot be changed' : `${t.brand.name} · ${t.factory.name} · revision ${t.currentRevision}`}
                  disabled={t.readOnly}
                  onPress={() => {
                    onChange({ id: t.id, code: t.code, name: t.name });
                    setOpen(false);
                    setText('');
                  }}
                  testID={`${testID}-option-${t.code}`}
                />
              ))
            )}
          </View>
          {value ? <Button title="Keep the current tool" variant="quiet" onPress={() => setOpen(false)} /> : null}
        </View>
      ) : null}
      <FieldError error={error} testID={`${testID}-error`} />
    </View>
  );
}

/** Find an existing product by SKU or name and pick it as the derivative. */
export function ProductPicker({
  value,
  onChange,
  disabled,
  error,
  testID = 'request-derivative',
}: {
  value: ProductChoice | null;
  onChange: (p: ProductChoice) => void;
  disabled?: boolean;
  error?: string;
  testID?: string;
}) {
  const [open, setOpen] = useState(!value);
  const [text, setText] = useState('');
  const q = useDebounced(text.trim(), 250);
  const showList = (open || !value) && !disabled;
  const products = useProductSearch(q, showList);
  return (
    <View style={styles.field}>
      {value && !showList ? (
        <Chosen code={value.sku} name={value.name} changeLabel="Change product" onChange={() => setOpen(true)} disabled={disabled} testID={`${testID}-chosen`} />
      ) : null}
      {showList ? (
        <View style={styles.search}>
          <TextField
            label="Find the product"
            placeholder="SKU or product name"
            value={text}
            onChangeText={setText}
            leadingIcon="search"
            autoCapitalize="none"
            autoCorrect={false}
            testID={`${testID}-search`}
          />
          <View style={styles.results} testID={`${testID}-results`}>
            {products.isPending ? (
              <ActivityIndicator color={colors.inkSoft} style={styles.note} />
            ) : products.isError ? (
              <AppText variant="small" tone="due" style={styles.note}>
                {toUserMessage(products.error)}
              </AppText>
            ) : products.data.length === 0 ? (
              <AppText variant="small" style={styles.note}>
                No product matches “{q}”. Create it as a new product instead.
              </AppText>
            ) : (
              products.data.map((p) => (
                <Option
                  key={p.id}
                  code={p.sku}
                  name={p.name}
                  detail={p.status === 'retired' ? 'Retired: cannot be the product of a change' : `${p.brand.name} · ${productStatusLabels[p.status]}`}
                  disabled={p.status === 'retired'}
                  onPress={() => {
                    onChange({ id: p.id, sku: p.sku, name: p.name });
                    setOpen(false);
                    setText('');
                  }}
                  testID={`${testID}-option-${p.sku}`}
                />
              ))
            )}
          </View>
        </View>
      ) : null}
      <FieldError error={error} testID={`${testID}-error`} />
    </View>
  );
}

const styles = StyleSheet.create({
  field: { gap: space.xs, alignSelf: 'stretch' },
  chosen: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    padding: space.md,
    borderRadius: radii.md,
    borderWidth: 1,
    borderColor: colors.steel,
    backgroundColor: colors.card,
  },
  chosenLocked: { backgroundColor: colors.steelWash, borderColor: colors.steelLight },
  chosenText: { flex: 1, gap: 2 },
  search: { gap: 0 },
  results: { borderRadius: radii.md, borderWidth: 1, borderColor: colors.steelLight, backgroundColor: colors.card, overflow: 'hidden', minHeight: touch, justifyContent: 'center', padding: 0 },
  option: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.sm,
    minHeight: touch + 8,
    paddingHorizontal: space.md,
    paddingVertical: space.sm,
    borderBottomWidth: 1,
    borderBottomColor: colors.steelLight,
  },
  note: { padding: space.md },
  optionPressed: { backgroundColor: colors.steelWash },
  optionDisabled: { opacity: 0.6 },
  optionHead: { flexDirection: 'row', alignItems: 'baseline', gap: space.sm },
  shrink: { flexShrink: 1 },
  slot: { minHeight: 24 },
  errorRow: { flexDirection: 'row', alignItems: 'flex-start', gap: space.xs, minHeight: 24, paddingTop: space.xs },
  errorText: { flex: 1, fontFamily: fonts.sansMedium },
});
