import { useState } from 'react';
import { Formik } from 'formik';
import { StyleSheet } from 'react-native';
import type { Brand } from '@shared/schemas/organisation';
import { applyServerErrors } from '@/api/errors';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { ListRow } from '@/components/ui/list-row';
import { Loading } from '@/components/ui/loading';
import { Screen } from '@/components/ui/screen';
import { Section } from '@/components/ui/section';
import { TextField } from '@/components/ui/text-field';
import { space } from '@/theme';
import { brandFormSchema, type BrandFormValues } from '../forms';
import { useBrands, useCreateBrand } from '../hooks';

const blank: BrandFormValues = { code: '', name: '' };

export function BrandsScreen() {
  const brands = useBrands();
  const create = useCreateBrand();
  const [added, setAdded] = useState<Brand | null>(null);

  return (
    <Screen title="Brands" eyebrow="Admin" back={{ href: '/admin', label: 'Administration' }} testID="brands-screen">
      <Section title="All brands">
        {brands.isPending ? (
          <Loading label="Loading brands…" />
        ) : brands.isError ? (
          <ErrorState error={brands.error} onRetry={() => void brands.refetch()} />
        ) : brands.data.length === 0 ? (
          <EmptyState icon="tag" title="No brands yet" body="Add the company's product lines below. Users and tools are assigned to brands." />
        ) : (
          <Card padded={false} testID="brand-rows">
            {brands.data.map((b, i) => (
              <ListRow key={b.id} title={b.name} meta={b.code} leadingIcon="tag" divider={i < brands.data.length - 1} testID={`brand-row-${b.code}`} />
            ))}
          </Card>
        )}
      </Section>
      <Section title="Add a brand">
        <Formik
          initialValues={blank}
          validationSchema={brandFormSchema}
          onSubmit={async (values, helpers) => {
            helpers.setStatus(undefined);
            setAdded(null);
            try {
              setAdded(await create.mutateAsync({ code: values.code.trim().toUpperCase(), name: values.name.trim() }));
              helpers.resetForm();
            } catch (e) {
              applyServerErrors(e, ['code', 'name'], helpers);
            }
          }}
        >
          {(f) => (
            <Card style={styles.form}>
              {added ? <Banner kind="go" title={`Brand ${added.code} added`} message={added.name} testID="brand-added" /> : null}
              {typeof f.status === 'string' ? <Banner kind="due" title="Not added" message={f.status} /> : null}
              <TextField
                label="Code"
                value={f.values.code}
                onChangeText={(t) => void f.setFieldValue('code', t.toUpperCase())}
                onBlur={f.handleBlur('code')}
                error={f.touched.code ? f.errors.code : undefined}
                hint="2 to 6 letters or digits; shown on tool and product codes."
                mono
                autoCapitalize="characters"
                maxLength={6}
                testID="brand-code"
              />
              <TextField
                label="Name"
                value={f.values.name}
                onChangeText={f.handleChange('name')}
                onBlur={f.handleBlur('name')}
                error={f.touched.name ? f.errors.name : undefined}
                testID="brand-name"
              />
              <Button title="Add brand" icon="plus" busy={f.isSubmitting} busyTitle="Adding…" onPress={() => f.handleSubmit()} testID="brand-submit" />
            </Card>
          )}
        </Formik>
      </Section>
    </Screen>
  );
}

const styles = StyleSheet.create({ form: { gap: space.xs, padding: space.xl } });
