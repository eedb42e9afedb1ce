import type { FormikProps } from 'formik';
import { roleLabels, roles, type Role } from '@shared/schemas/users';
import { Banner } from '@/components/ui/banner';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { Loading } from '@/components/ui/loading';
import { TextField } from '@/components/ui/text-field';
import { toUserMessage } from '@/api/errors';
import { useBrands, useFactories } from '../hooks';

interface UserFieldValues {
  name: string;
  role: Role;
  brandIds: string[];
  factoryId: string | null;
  timeZone: string;
}

const roleHints: Record<Role, string> = {
  designer: 'drafts requests',
  engineer: 'reviews and prices',
  brand_lead: 'final approval',
  toolmaker: 'factory side',
  admin: 'people and setup',
};

/**
 * Role, brands, factory and time zone: the fields the create and edit forms share.
 * Brands show for company roles; the factory only for toolmakers (the API rejects it otherwise).
 */
export function UserRoleFields<V extends UserFieldValues>({ f, testID = 'user' }: { f: FormikProps<V>; testID?: string }) {
  const brands = useBrands();
  const factories = useFactories();
  const err = (k: keyof UserFieldValues) => (f.touched[k] || f.submitCount > 0 ? (f.errors[k] as string | undefined) : undefined);

  const pickFactory = (id: string) => {
    const factory = factories.data?.find((x) => x.id === id);
    const previous = factories.data?.find((x) => x.id === f.values.factoryId);
    // A toolmaker works in the factory's zone: follow it unless the zone was set by hand.
    const follow = factory && (f.values.timeZone === 'UTC' || f.values.timeZone === '' || f.values.timeZone === previous?.timeZone);
    // One update, so validation sees the factory and the zone together.
    void f.setValues({ ...f.values, factoryId: id, timeZone: follow ? factory.timeZone : f.values.timeZone });
  };

  return (
    <>
      <ChoiceGroup
        label="Role"
        options={roles.map((r) => ({ value: r, label: roleLabels[r], hint: roleHints[r] }))}
        value={f.values.role}
        onChange={(r) => void f.setFieldValue('role', r)}
        error={err('role')}
        testID={`${testID}-role`}
      />
      {f.values.role === 'toolmaker' ? (
        factories.isPending ? (
          <Loading label="Loading factories…" />
        ) : factories.isError ? (
          <Banner kind="due" title="Factories did not load" message={toUserMessage(factories.error)} />
        ) : (
          <ChoiceGroup
            label="Factory"
            options={factories.data.map((x) => ({ value: x.id, label: x.name, hint: `${x.city}, ${x.country}` }))}
            value={f.values.factoryId}
            onChange={pickFactory}
            error={err('factoryId')}
            hint="A toolmaker sees only requests released to this factory."
            testID={`${testID}-factory`}
          />
        )
      ) : brands.isPending ? (
        <Loading label="Loading brands…" />
      ) : brands.isError ? (
        <Banner kind="due" title="Brands did not load" message={toUserMessage(brands.error)} />
      ) : (
        <ChoiceGroup
          multiple
          label="Brands"
          options={brands.data.map((b) => ({ value: b.id, label: b.name, code: b.code }))}
          value={f.values.brandIds}
          onChange={(ids) => void f.setFieldValue('brandIds', ids)}
          error={err('brandIds')}
          hint={f.values.role === 'brand_lead' ? 'A brand lead approves requests for these brands.' : 'The brands this person works on.'}
          testID={`${testID}-brands`}
        />
      )}
      <TextField
        label="Time zone"
        value={f.values.timeZone}
        onChangeText={f.handleChange('timeZone')}
        onBlur={f.handleBlur('timeZone')}
        error={err('timeZone')}
        hint="Sign-off times show in this zone, e.g. Asia/Shanghai, America/Los_Angeles."
        mono
        autoCapitalize="none"
        autoCorrect={false}
        testID={`${testID}-time-zone`}
      />
    </>
  );
}
