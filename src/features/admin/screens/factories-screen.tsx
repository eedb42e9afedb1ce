import { useState } from 'react';
import { Formik } from 'formik';
import { StyleSheet } from 'react-native';
import type { Factory } from '@shared/schemas/organisation';
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
import { factoryFormSchema, type FactoryFormValues } from '../forms';
import { useCreateFactory, useFactories } from '../hooks';

const blank: FactoryFormValues = { name: '', city: '', country: '', timeZone: '' };
const fields = ['name', 'city', 'country', 'timeZone'] as const;

export function FactoriesScreen() {
  const factories = useFactories();
  const create = useCreateFactory();
  const [added, setAdded] = useState<Factory | null>(null);

  return (
    <Screen title="Factories" eyebrow="Admin" back={{ href: '/admin', label: 'Administration' }} testID="factories-screen">
      <Section title="All factories">
        {factories.isPending ? (
          <Loading label="Loading factories…" />
        ) : factories.isError ? (
          <ErrorState error={factories.error} onRetry={() => void factories.refetch()} />
        ) : factories.data.length === 0 ? (
          <EmptyState icon="factory" title="No factories yet" body="Add the molding vendors below. Toolmakers belong to one factory and tools sit in one." />
        ) : (
          <Card padded={false} testID="factory-rows">
            {factories.data.map((x, i) => (
              <ListRow
                key={x.id}
                title={x.name}
                subtitle={`${x.city}, ${x.country} · ${x.timeZone}`}
                leadingIcon="factory"
                divider={i < factories.data.length - 1}
                testID={`factory-row-${x.id}`}
              />
            ))}
          </Card>
        )}
      </Section>
      <Section title="Add a factory">
        <Formik
          initialValues={blank}
          validationSchema={factoryFormSchema}
          onSubmit={async (values, helpers) => {
            helpers.setStatus(undefined);
            setAdded(null);
            try {
              setAdded(
                await create.mutateAsync({
                  name: values.name.trim(),
                  city: values.city.trim(),
                  country: values.country.trim(),
                  timeZone: values.timeZone.trim(),
                }),
              );
              helpers.resetForm();
            } catch (e) {
              applyServerErrors(e, fields, helpers);
            }
          }}
        >
          {(f) => (
            <Card style={styles.form}>
              {added ? <Banner kind="go" title={`${added.name} added`} message={`${added.city}, ${added.country} · ${added.timeZone}`} testID="factory-added" /> : null}
              {typeof f.status === 'string' ? <Banner kind="due" title="Not added" message={f.status} /> : null}
              <TextField label="Name" value={f.values.name} onChangeText={f.handleChange('name')} onBlur={f.handleBlur('name')} error={f.touched.name ? f.errors.name : undefined} testID="factory-name" />
              <TextField label="City" value={f.values.city} onChangeText={f.handleChange('city')} onBlur={f.handleBlur('city')} error={f.touched.city ? f.errors.city : undefined} testID="factory-city" />
              <TextField label="Country" value={f.values.country} onChangeText={f.handleChange('country')} onBlur={f.handleBlur('country')} error={f.touched.country ? f.errors.country : undefined} testID="factory-country" />
              <TextField
                label="Time zone"
                value={f.values.timeZone}
                onChangeText={f.handleChange('timeZone')}
                onBlur={f.handleBlur('timeZone')}
                error={f.touched.timeZone ? f.errors.timeZone : undefined}
                hint="The factory's local zone, e.g. Asia/Shanghai."
                mono
                autoCapitalize="none"
                autoCorrect={false}
                testID="factory-time-zone"
              />
              <Button title="Add factory" icon="plus" busy={f.isSubmitting} busyTitle="Adding…" onPress={() => f.handleSubmit()} testID="factory-submit" />
            </Card>
          )}
        </Formik>
      </Section>
    </Screen>
  );
}

const styles = StyleSheet.create({ form: { gap: space.xs, padding: space.xl } });
