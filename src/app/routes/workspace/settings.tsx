import { useState, type FormEvent } from 'react';
import { can } from '#shared/permissions.ts';
import { currencyOptions, studioSettingsInputSchema } from '#shared/studio.ts';
import { WithWorkspace } from '#src/app/layouts/workspace-layout.tsx';
import { Card, CardTitle } from '#src/components/ui/card.tsx';
import { SelectField } from '#src/components/ui/field.tsx';
import { TextField } from '#src/components/ui/text-field.tsx';
import { Button } from '#src/components/ui/button.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { useToast } from '#src/components/ui/toast.tsx';
import type { Workspace } from '#src/features/workspace/api/get-workspace.ts';
import { useUpdateSettings } from '#src/features/workspace/api/update-settings.ts';
import { useFieldErrors } from '#src/lib/use-field-errors.ts';
import { OrderSettingsCard, ShippingRatesCard } from '#src/features/workspace/components/order-settings.tsx';
import { LogoCard } from '#src/features/workspace/components/logo-card.tsx';

export function SettingsPage() {
  return (
    <WithWorkspace>
      {(workspace) =>
        can(workspace.role, 'studio:settings') ? (
          <div className="flex max-w-2xl flex-col gap-6">
            <h1 className="text-3xl font-extrabold">Settings</h1>
            <SettingsForm workspace={workspace} />
            <LogoCard workspace={workspace} />
            <OrderSettingsCard workspace={workspace} />
            <ShippingRatesCard workspace={workspace} />
          </div>
        ) : (
          <Notice tone="error" title="Owners only">
            Your role in this studio does not allow changing its settings. Ask an owner.
          </Notice>
        )
      }
    </WithWorkspace>
  );
}

function SettingsForm({ workspace }: { workspace: Workspace }) {
  const { studio } = workspace;
  const save = useUpdateSettings(studio.slug);
  const form = useFieldErrors();
  const toast = useToast();
  const [accent, setAccent] = useState(studio.accentColour);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const values = form.check(studioSettingsInputSchema, {
      ...Object.fromEntries(new FormData(event.currentTarget)),
      accentColour: accent,
    });
    if (!values) return;
    try {
      await save.mutateAsync(values);
      toast.show('Settings saved.', 'success');
    } catch (error) {
      form.show(error);
    }
  }

  return (
    <>
      <Card>
        <CardTitle>Studio and storefront</CardTitle>
        <form onSubmit={onSubmit} className="flex flex-col gap-4" noValidate>
          {form.formError && <Notice tone="error">{form.formError}</Notice>}
          <TextField label="Studio name" name="name" defaultValue={studio.name} error={form.errors.name} />
          <div className="flex items-end gap-3">
            <TextField
              label="Storefront colour"
              name="accentText"
              value={accent}
              onChange={(e) => setAccent(e.target.value)}
              error={form.errors.accentColour}
              className="flex-1"
            />
            <label className="sr-only" htmlFor="accent-picker">
              Pick the storefront colour
            </label>
            <input
              id="accent-picker"
              type="color"
              value={/^#[0-9a-f]{6}$/i.test(accent) ? accent : '#000000'}
              onChange={(e) => setAccent(e.target.value)}
              className="h-10 w-14 rounded-lg border border-graphite-200"
            />
          </div>
          <SelectField
            label="Currency"
            name="currency"
            defaultValue={studio.currency}
            options={currencyOptions()}
            hint="Prices are kept in its smallest unit (cents, pence…)."
            error={form.errors.currency}
          />
          <div className="flex flex-col gap-1.5">
            <label htmlFor="units" className="text-sm font-semibold text-graphite-800">
              Show sizes in
            </label>
            <select
              id="units"
              name="units"
              defaultValue={studio.units}
              className="h-10 rounded-lg border border-graphite-200 bg-white px-3"
            >
              <option value="in">inches</option>
              <option value="mm">millimetres</option>
            </select>
          </div>
          <TextField
            label="Contact e-mail for buyers"
            name="contactEmail"
            type="email"
            defaultValue={studio.contactEmail ?? ''}
            error={form.errors.contactEmail}
          />
          <Button type="submit" busy={save.isPending} className="self-start">
            Save settings
          </Button>
        </form>
      </Card>
    </>
  );
}
