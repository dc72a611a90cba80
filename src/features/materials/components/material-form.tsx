import { zodResolver } from '@hookform/resolvers/zod';
import { type Resolver, type UseFormRegisterReturn, useForm } from 'react-hook-form';
import { PRESS_DEFAULT_SOURCES } from '../../../../shared/engine/press-defaults.ts';
import {
  COMMON_ROLL_WIDTHS_MM,
  createMaterialSchema,
  defaultPressProfile,
  MATERIAL_DEFAULTS,
  MATERIAL_KINDS,
  type Material,
  type MaterialKind,
  updateMaterialSchema,
} from '../../../../shared/schemas/material.ts';
import { cToF, formatLength, roundTo } from '../../../../shared/units.ts';
import { Button } from '../../../components/ui/button.tsx';
import { CheckboxField, FormSection, SelectField } from '../../../components/ui/form-controls.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { applyServerErrors } from '../../../lib/form-errors.ts';
import { useCreateMaterial } from '../api/create-material.ts';
import { useUpdateMaterial } from '../api/update-material.ts';

export const KIND_LABELS: Record<MaterialKind, string> = { smooth: 'Smooth', glitter: 'Glitter', flock: 'Flock', metallic: 'Metallic', patterned: 'Patterned' };

/** The material's own fields, all of which the form holds. */
type Values = Omit<Material, 'id' | 'lowStock' | 'archived' | 'createdAt'>;
const FIELDS = [
  'kind',
  'colourName',
  'colourHex',
  'rollWidthMm',
  'stockMm',
  'lowStockMm',
  'pricePerMetreMinor',
  'pressProfile.handheld.tempC',
  'pressProfile.handheld.timeS',
  'pressProfile.clamshell.tempC',
  'pressProfile.clamshell.timeS',
  'pressProfile.tackS',
  'pressProfile.peel',
  'pressProfile.coolS',
] as const;

const blank = (): Values => ({
  kind: 'smooth',
  colourName: '',
  colourHex: '#2f7d6d',
  rollWidthMm: COMMON_ROLL_WIDTHS_MM[0],
  stockMm: 5000,
  ...MATERIAL_DEFAULTS,
  pressProfile: defaultPressProfile('smooth'),
});

const fahrenheit = (c: number) => (Number.isFinite(c) ? `${roundTo(cToF(c), 0)} °F` : '— °F');
const lengthHint = (mm: number) => (Number.isFinite(mm) && mm > 0 ? formatLength(mm) : '\u00a0');

/** Add or edit one material. The press profile follows the kind's defaults (shared/engine/press-defaults.ts) until edited. */
export function MaterialForm({ material, onDone }: { material?: Material; onDone: () => void }) {
  const toast = useToast();
  const create = useCreateMaterial();
  const update = useUpdateMaterial();
  const { register, handleSubmit, setError, setValue, watch, formState } = useForm<Values>({
    // the create and update schemas take the same fields; the form holds them all
    resolver: (material ? zodResolver(updateMaterialSchema) : zodResolver(createMaterialSchema)) as unknown as Resolver<Values>,
    defaultValues: material
      ? {
          kind: material.kind,
          colourName: material.colourName,
          colourHex: material.colourHex,
          rollWidthMm: material.rollWidthMm,
          stockMm: material.stockMm,
          lowStockMm: material.lowStockMm,
          pricePerMetreMinor: material.pricePerMetreMinor,
          pressProfile: { coolS: defaultPressProfile(material.kind as MaterialKind).coolS, ...structuredClone(material.pressProfile) },
        }
      : blank(),
  });
  const e = formState.errors;
  const v = watch();
  const num = (name: Parameters<typeof register>[0]): UseFormRegisterReturn => register(name, { valueAsNumber: true });

  const onSubmit = handleSubmit(async (values) => {
    try {
      if (material) await update.mutateAsync({ id: material.id, input: values });
      else await create.mutateAsync(values);
      toast.success(material ? 'Material saved.' : 'Material added.');
      onDone();
    } catch (error) {
      const message = applyServerErrors(error, setError, FIELDS);
      if (message) toast.error(message);
    }
  });

  const kindField = register('kind', {
    onChange: (ev: { target: { value: MaterialKind } }) => setValue('pressProfile', defaultPressProfile(ev.target.value), { shouldDirty: true }),
  });

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-5" aria-label={material ? 'Edit material' : 'Add a material'}>
      <FormSection title="Vinyl">
        <div className="grid grid-cols-1 gap-5 sm:grid-cols-2">
          <SelectField label="Kind" hint="Changing the kind fills in its press defaults." error={e.kind?.message} {...kindField}>
            {MATERIAL_KINDS.map((k) => (
              <option key={k} value={k}>
                {KIND_LABELS[k]}
              </option>
            ))}
          </SelectField>
          <TextField label="Colour name" placeholder="e.g. Pine green" maxLength={40} error={e.colourName?.message} {...register('colourName')} />
        </div>
        <div className="grid grid-cols-1 items-start gap-5 sm:grid-cols-2">
          <div className="flex items-end gap-3">
            <TextField label="Colour (hex)" hint="Used for previews and swatches." maxLength={7} spellCheck={false} className="flex-1" error={e.colourHex?.message} {...register('colourHex')} />
            <label className="mb-0.5 flex flex-col items-center gap-1 text-sm font-bold">
              <span className="sr-only">Pick the colour</span>
              <input
                type="color"
                aria-label="Pick the colour"
                value={/^#[0-9a-fA-F]{6}$/.test(v.colourHex) ? v.colourHex : '#000000'}
                onChange={(ev) => setValue('colourHex', ev.target.value, { shouldDirty: true, shouldValidate: true })}
                className="h-11 w-14 cursor-pointer rounded-lg border-2 border-field bg-white p-1"
              />
            </label>
          </div>
          <div className="flex flex-col gap-2">
            <TextField label="Roll width (mm)" hint={lengthHint(v.rollWidthMm)} type="number" inputMode="decimal" min={50} max={1600} error={e.rollWidthMm?.message} {...num('rollWidthMm')} />
            <fieldset className="flex min-w-0 flex-wrap gap-2" aria-label="Common roll widths">
              {COMMON_ROLL_WIDTHS_MM.map((w) => (
                <button
                  key={w}
                  type="button"
                  onClick={() => setValue('rollWidthMm', w, { shouldDirty: true, shouldValidate: true })}
                  className="min-h-9 rounded-lg border border-thread px-3 text-sm font-bold text-thread-deep hover:bg-thread-wash"
                >
                  {formatLength(w)}
                </button>
              ))}
            </fieldset>
          </div>
        </div>
        <div className="grid grid-cols-1 gap-5 sm:grid-cols-2">
          <TextField label="Length in stock (mm)" hint={lengthHint(v.stockMm)} type="number" inputMode="decimal" min={0} error={e.stockMm?.message} {...num('stockMm')} />
          <TextField
            label="Low-stock mark (mm)"
            hint={`Flag it when the roll gets this short. ${lengthHint(v.lowStockMm)}`}
            type="number"
            inputMode="decimal"
            min={0}
            error={e.lowStockMm?.message}
            {...num('lowStockMm')}
          />
        </div>
      </FormSection>

      <FormSection
        title="Press profile"
        lead={
          <>
            Defaults for {KIND_LABELS[v.kind]?.toLowerCase() ?? 'this kind'} ({PRESS_DEFAULT_SOURCES[v.kind] ?? 'from memory'}); follow your vinyl maker's instructions where they differ.
          </>
        }
      >
        <div className="grid grid-cols-1 gap-5 sm:grid-cols-2">
          {(['clamshell', 'handheld'] as const).map((press) => (
            <div key={press} className="flex flex-col gap-3 rounded-lg bg-paper p-4">
              <h3 className="font-extrabold">{press === 'clamshell' ? 'Clamshell press' : 'Handheld press'}</h3>
              <div className="grid grid-cols-2 gap-3">
                <TextField
                  label="Temperature (°C)"
                  hint={fahrenheit(v.pressProfile?.[press]?.tempC)}
                  type="number"
                  inputMode="decimal"
                  error={e.pressProfile?.[press]?.tempC?.message}
                  {...num(`pressProfile.${press}.tempC`)}
                />
                <TextField label="Time (s)" hint={'\u00a0'} type="number" inputMode="decimal" error={e.pressProfile?.[press]?.timeS?.message} {...num(`pressProfile.${press}.timeS`)} />
              </div>
            </div>
          ))}
        </div>
        <div className="grid grid-cols-1 gap-5 sm:grid-cols-2">
          <TextField
            label="Tack between layers (s)"
            hint="A short press before the next layer goes on."
            type="number"
            inputMode="decimal"
            error={e.pressProfile?.tackS?.message}
            {...num('pressProfile.tackS')}
          />
          <SelectField label="Peel" hint="When to take the carrier sheet off." error={e.pressProfile?.peel?.message} {...register('pressProfile.peel')}>
            <option value="hot">Hot</option>
            <option value="warm">Warm</option>
            <option value="cold">Cold</option>
            <option value="hot or cold">Hot or cold</option>
          </SelectField>
          <TextField
            label="Cool before a warm or cold peel (s)"
            hint="The press run counts this down before the peel."
            type="number"
            inputMode="decimal"
            error={e.pressProfile?.coolS?.message}
            {...num('pressProfile.coolS')}
          />
        </div>
        <CheckboxField label="Top layer only" hint="Nothing may be pressed onto this material where layers overlap." {...register('pressProfile.topOnly')} />
        <Button variant="quiet" className="self-start" onClick={() => setValue('pressProfile', defaultPressProfile(v.kind), { shouldDirty: true })}>
          Reset to the {KIND_LABELS[v.kind]?.toLowerCase()} defaults
        </Button>
      </FormSection>

      <div className="flex flex-wrap gap-3">
        <Button type="submit" pending={formState.isSubmitting} pendingLabel="Saving…">
          {material ? 'Save material' : 'Add material'}
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
