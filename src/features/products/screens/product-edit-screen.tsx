import { useMemo, useState } from 'react';
import { router } from 'expo-router';
import { Formik, type FormikHelpers } from 'formik';
import { StyleSheet, View } from 'react-native';
import { productStatusLabels, productStatuses, type Product, type ProductStatus } from '@shared/schemas/registry';
import { ApiError, applyServerErrors, isApiError, toUserMessage } from '@/api/errors';
import { AppText } from '@/components/ui/app-text';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { Screen } from '@/components/ui/screen';
import { TextField } from '@/components/ui/text-field';
import { space } from '@/theme';
import { useWide } from '@/theme/use-wide';
import { productFormFrom, productFormSchema, productServerFieldMap, toUpdateProductPayload, type ProductFormValues } from '../forms';
import { useBrands, useCanEditRegistry, useProduct, useUpdateProduct } from '../hooks';
import { useEditSnapshot } from '@/lib/use-edit-snapshot';

const formFields = ['sku', 'name', 'brandId', 'status', 'fob', 'wholesale', 'retail', 'currency', 'plannedUnits'];

function applyProductErrors(e: unknown, helpers: FormikHelpers<ProductFormValues>) {
  if (isApiError(e) && e.fieldErrors) {
    const mapped = Object.fromEntries(Object.entries(e.fieldErrors).map(([k, v]) => [productServerFieldMap[k] ?? k, v]));
    return applyServerErrors(new ApiError(e.status, e.code, e.message, mapped), formFields, helpers);
  }
  applyServerErrors(e, formFields, helpers);
}

/** Edit a product's name, status, prices and planned units (engineers and admins). */
export function ProductEditScreen({ productId }: { productId: string }) {
  const canEdit = useCanEditRegistry();
  const product = useProduct(productId);
  const { snapshot, reloading, reload } = useEditSnapshot(product);
  const back = { href: '/products' as const, label: 'Products' };
  if (!canEdit) {
    return (
      <Screen title="Edit product" back={back}>
        <Banner kind="info" icon="lock" title="Only tooling engineers and administrators edit products" message="Ask the tooling engineer to make the change." />
      </Screen>
    );
  }
  if (product.isError && !snapshot) {
    return (
      <Screen title="Edit product" back={back}>
        <ErrorState error={product.error} onRetry={() => void product.refetch()} />
      </Screen>
    );
  }
  if (!snapshot) return <Loading fill label="Loading product…" />;
  return <ProductEditForm key={snapshot.version} product={snapshot} onReload={() => void reload()} reloading={reloading} />;
}

function ProductEditForm({ product, onReload, reloading }: { product: Product; onReload: () => void; reloading: boolean }) {
  const wide = useWide();
  const brands = useBrands();
  const update = useUpdateProduct(product.id);
  const [stale, setStale] = useState(false);
  const initial = useMemo(() => productFormFrom(product), [product]);
  const detail = { pathname: '/products/[id]' as const, params: { id: product.id } };
  const leave = () => (router.canGoBack() ? router.back() : router.replace(detail));
  const pair = [styles.pair, wide && styles.pairWide];

  return (
    <Screen eyebrow={product.sku} title="Edit product" back={{ href: detail, label: product.name }} testID="product-edit-screen">
      <Formik
        initialValues={initial}
        validationSchema={productFormSchema}
        onSubmit={async (values, helpers) => {
          helpers.setStatus(undefined);
          try {
            await update.mutateAsync(toUpdateProductPayload(initial, values, product.version));
            leave();
          } catch (e) {
            if (isApiError(e) && e.code === 'stale_version') return setStale(true);
            applyProductErrors(e, helpers);
          }
        }}
      >
        {(f) => {
          const err = (k: keyof ProductFormValues) => (f.touched[k] || f.submitCount > 0 ? f.errors[k] : undefined);
          const text = (k: keyof ProductFormValues) => ({
            value: f.values[k],
            onChangeText: f.handleChange(k),
            onBlur: f.handleBlur(k),
            error: err(k),
            testID: `product-form-${k}`,
          });
          return (
            <View style={styles.form}>
              {stale ? (
                <Banner kind="due" title="Someone else changed this product" testID="product-edit-stale">
                  <AppText variant="body">Your changes were not saved. Reload to see the current version, then make your changes again.</AppText>
                  <Button title="Reload the product" icon="refresh" variant="secondary" busy={reloading} onPress={onReload} testID="product-edit-reload" />
                </Banner>
              ) : null}
              {typeof f.status === 'string' ? <Banner kind="due" title="Not saved" message={f.status} testID="product-edit-error" /> : null}
              <Card style={styles.group}>
                <TextField label="SKU" mono autoCapitalize="characters" autoCorrect={false} {...text('sku')} />
                <TextField label="Name" {...text('name')} />
                {brands.isError ? (
                  <Banner kind="due" title="Brands did not load" message={toUserMessage(brands.error)} />
                ) : (
                  <ChoiceGroup
                    label="Brand"
                    options={(brands.data ?? []).map((b) => ({ value: b.id, label: b.name, code: b.code }))}
                    value={f.values.brandId || null}
                    onChange={(v) => void f.setFieldValue('brandId', v)}
                    error={err('brandId')}
                    testID="product-form-brandId"
                  />
                )}
                <ChoiceGroup<ProductStatus>
                  label="Status"
                  options={productStatuses.map((s) => ({ value: s, label: productStatusLabels[s] }))}
                  value={f.values.status}
                  onChange={(v) => void f.setFieldValue('status', v)}
                  hint="A retired product is no longer ended by a change to its tools."
                  error={err('status')}
                  testID="product-form-status"
                />
              </Card>
              <Card style={styles.group}>
                <AppText variant="heading" role="heading" aria-level={2}>
                  Prices and plan
                </AppText>
                <View style={pair}>
                  <View style={styles.cell}>
                    <TextField label="FOB cost" mono keyboardType="decimal-pad" placeholder="3.10" {...text('fob')} />
                  </View>
                  <View style={styles.cell}>
                    <TextField label="Wholesale" mono keyboardType="decimal-pad" placeholder="6.50" {...text('wholesale')} />
                  </View>
                </View>
                <View style={pair}>
                  <View style={styles.cell}>
                    <TextField label="Retail" mono keyboardType="decimal-pad" placeholder="12.99" {...text('retail')} />
                  </View>
                  <View style={styles.cell}>
                    <TextField label="Currency" mono autoCapitalize="characters" maxLength={3} {...text('currency')} />
                  </View>
                </View>
                <TextField label="Planned units" mono keyboardType="number-pad" {...text('plannedUnits')} />
              </Card>
              <View style={styles.buttons}>
                <Button title="Save changes" icon="check" busy={f.isSubmitting} busyTitle="Saving…" disabled={!f.dirty || stale} onPress={() => f.handleSubmit()} testID="product-edit-save" />
                <Button title="Cancel" variant="secondary" onPress={leave} />
              </View>
            </View>
          );
        }}
      </Formik>
    </Screen>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.lg },
  group: { gap: space.xs, padding: space.xl },
  pair: { gap: space.xs },
  pairWide: { flexDirection: 'row', gap: space.lg },
  cell: { flex: 1 },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
