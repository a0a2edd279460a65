import { zodResolver } from '@hookform/resolvers/zod';
import { siteInputSchema, type Site } from '@stringfield/shared';
import { useForm } from 'react-hook-form';
import { toast } from '@/lib/toast';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { FormField, Input, Select } from '@/components/ui/form-field';
import { splitServerErrors } from '@/lib/form-errors';
import { useCreateSite } from '../api/create-site';
import { parseDecimal } from '../lib/parse-decimal';
import { QuantityInput } from './quantity-input';

const fieldNames = ['name', 'code', 'address', 'timeZone', 'lowestAmbientC', 'highestAmbientC', 'designIrradianceWm2', 'ownerContactEmail'] as const;

/* Read once: the browser's own list of IANA zones. Chromium leaves UTC out of it, so add it. */
const timeZones: readonly string[] = (() => {
  try {
    return [...new Set(['UTC', ...Intl.supportedValuesOf('timeZone')])];
  } catch {
    return ['UTC'];
  }
})();
const browserZone = Intl.DateTimeFormat().resolvedOptions().timeZone;

const decimal = { setValueAs: parseDecimal };

export function CreateSiteDialog({ isOpen, onClose, onCreated }: { isOpen: boolean; onClose: () => void; onCreated: (site: Site) => void }) {
  const create = useCreateSite();
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors },
  } = useForm({
    resolver: zodResolver(siteInputSchema),
    defaultValues: {
      name: '',
      code: '',
      address: '',
      timeZone: timeZones.includes(browserZone) ? browserZone : 'UTC',
      designIrradianceWm2: 1000,
      ownerContactEmail: '',
      ownerUserIds: [],
    },
  });

  const close = () => {
    reset();
    create.reset();
    onClose();
  };

  const onSubmit = handleSubmit((values) => {
    create.mutate(values, {
      onSuccess: (site) => {
        toast.success(`${site.name} (${site.code}) is registered`, { description: 'Import its string layout next.' });
        reset();
        onCreated(site);
      },
      onError: (error) => {
        const split = splitServerErrors(error, fieldNames);
        for (const [name, message] of split.fieldErrors) setError(name, { type: 'server', message }, { shouldFocus: true });
        if (split.formError) setError('root', { type: 'server', message: split.formError });
      },
    });
  });

  return (
    <Dialog isOpen={isOpen} onClose={close} title="New site" description="The ambient range drives the cold-Voc and hot-Vmp sizing checks of every string.">
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
        <div aria-live="assertive" className="empty:hidden">
          {errors.root?.message ? <Alert tone="fail">{errors.root.message}</Alert> : null}
        </div>
        <FormField label="Site name" error={errors.name?.message}>
          <Input autoComplete="off" {...register('name')} />
        </FormField>
        <FormField label="Site code" hint="2 to 8 letters or digits, printed on every QR label (like FWM)." error={errors.code?.message}>
          <Input autoComplete="off" autoCapitalize="characters" spellCheck={false} className="readings font-mono uppercase" maxLength={8} {...register('code')} />
        </FormField>
        <FormField label="Address or location" isOptional error={errors.address?.message}>
          <Input autoComplete="off" {...register('address')} />
        </FormField>
        <FormField label="Time zone" hint="Local time of the plant, for due times and reports." error={errors.timeZone?.message}>
          <Select {...register('timeZone')}>
            {timeZones.map((zone) => (
              <option key={zone} value={zone}>
                {zone.replace(/_/g, ' ')}
              </option>
            ))}
          </Select>
        </FormField>
        <div className="grid gap-5 sm:grid-cols-2">
          <FormField label="Lowest ambient" hint="Extreme minimum (ASHRAE)." error={errors.lowestAmbientC?.message}>
            <QuantityInput unit="°C" {...register('lowestAmbientC', decimal)} />
          </FormField>
          <FormField label="Highest ambient" hint="2 % design high." error={errors.highestAmbientC?.message}>
            <QuantityInput unit="°C" {...register('highestAmbientC', decimal)} />
          </FormField>
        </div>
        <FormField label="Design irradiance" hint="For the hot-day and power checks; 1000 unless your design says otherwise." error={errors.designIrradianceWm2?.message}>
          <QuantityInput unit="W/m²" {...register('designIrradianceWm2', decimal)} />
        </FormField>
        <FormField label="Owner contact e-mail" hint="Who receives the asset owner's reports." error={errors.ownerContactEmail?.message}>
          <Input type="email" inputMode="email" autoCapitalize="none" spellCheck={false} autoComplete="off" {...register('ownerContactEmail')} />
        </FormField>
        <div className="flex flex-col-reverse gap-3 sm:flex-row sm:justify-end">
          <Button variant="secondary" onClick={close} disabled={create.isPending}>
            Cancel
          </Button>
          <Button type="submit" variant="primary" isPending={create.isPending}>
            {create.isPending ? 'Saving site…' : 'Create site'}
          </Button>
        </div>
      </form>
    </Dialog>
  );
}
