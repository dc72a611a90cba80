/**
 * A blank type with its sizes and colours, checked by the schema the API uses
 * (shared/schemas/blanks.ts); the server's field messages land on their inputs.
 */
import type { ComponentType } from 'react';
import { Controller, useFieldArray } from 'react-hook-form';
import { type BlankTypeInput, blankTypeInputSchema, MAX_BLANK_COLOURS, MAX_BLANK_SIZES, type SellerBlankType } from '../../../../shared/schemas/blanks.ts';
import { BLANK_DEFAULTS, BLANK_KINDS } from '../../../../shared/schemas/listing.ts';
import { formatLength } from '../../../../shared/units.ts';
import { Button } from '../../../components/ui/button.tsx';
import { FormSection, MoneyController, SelectField, SubmitForm } from '../../../components/ui/form-controls.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { useServerForm } from '../../../lib/use-server-form.ts';
import { useSaveBlankType } from '../api/blanks.ts';

const newSize = (): BlankTypeInput['sizes'][number] => ({ label: '', widthMm: 200, heightMm: 200, topOffsetMm: 50, priceDiffMinor: 0, chestMm: null, lengthMm: null });
const newColour = (): BlankTypeInput['colours'][number] => ({ name: '', hex: '#ffffff', photoId: null });
const mmHint = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) && v > 0 ? formatLength(v) : '\u00a0');
/** an empty optional measurement is null, not NaN */
const optionalMm = { setValueAs: (v: string) => (v === '' || v === null ? null : Number(v)) };

/** the uploads feature's photo picker, handed in by the page (one photo per colour) */
export type ColourPhotoPicker = ComponentType<{ value: string[]; onChange: (ids: string[]) => void; max?: number; error?: string }>;

export function BlankTypeForm({
  type,
  start,
  currency,
  onDone,
  PhotoPicker,
}: {
  type?: SellerBlankType;
  start: BlankTypeInput;
  currency: string;
  onDone: () => void;
  PhotoPicker?: ColourPhotoPicker;
}) {
  const toast = useToast();
  const save = useSaveBlankType();
  const defaults: BlankTypeInput = type ? { name: type.name, shape: type.shape, sizes: type.sizes, colours: type.colours.map(({ photoUrl: _p, ...c }) => c) } : start;
  const form = useServerForm<BlankTypeInput>({
    schema: blankTypeInputSchema as never,
    defaultValues: defaults,
    fields: ['name', 'shape', 'sizes', 'colours'],
    submit: async (values) => {
      await save.mutateAsync({ id: type?.id, input: values });
      toast.success(`${values.name} saved.`);
      onDone();
    },
  });
  const { register, control, watch, formState } = form;
  const e = formState.errors;
  const sizes = useFieldArray({ control, name: 'sizes' });
  const colours = useFieldArray({ control, name: 'colours' });
  const v = watch();

  return (
    <SubmitForm {...form.formProps} pendingLabel="Saving…" submitLabel={type ? 'Save blank type' : 'Add blank type'}>
      <div className="grid grid-cols-1 gap-5 sm:grid-cols-2">
        <TextField label="Name" hint="Shoppers pick “<name> colour”, e.g. “Tee colour”." maxLength={40} error={e.name?.message} {...register('name')} />
        <SelectField label="Drawn and placed as" error={e.shape?.message} {...register('shape')}>
          {BLANK_KINDS.map((k) => (
            <option key={k} value={k}>
              {BLANK_DEFAULTS[k].label}
            </option>
          ))}
        </SelectField>
      </div>

      <FormSection title="Sizes" lead="Each size has its own print area, top offset and price difference; measurements (laid flat) fill the shoppers' size chart.">
        {sizes.fields.map((f, i) => (
          <fieldset key={f.id} className="flex flex-col gap-3 rounded-lg border border-line p-3">
            <legend className="px-1 font-bold">Size {i + 1}</legend>
            <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
              <TextField label="Label" maxLength={12} error={e.sizes?.[i]?.label?.message} {...register(`sizes.${i}.label`)} />
              <TextField
                label="Print width (mm)"
                type="number"
                inputMode="decimal"
                hint={mmHint(v.sizes?.[i]?.widthMm)}
                error={e.sizes?.[i]?.widthMm?.message}
                {...register(`sizes.${i}.widthMm`, { valueAsNumber: true })}
              />
              <TextField
                label="Print height (mm)"
                type="number"
                inputMode="decimal"
                hint={mmHint(v.sizes?.[i]?.heightMm)}
                error={e.sizes?.[i]?.heightMm?.message}
                {...register(`sizes.${i}.heightMm`, { valueAsNumber: true })}
              />
              <TextField
                label="Top offset (mm)"
                type="number"
                inputMode="decimal"
                hint={mmHint(v.sizes?.[i]?.topOffsetMm)}
                error={e.sizes?.[i]?.topOffsetMm?.message}
                {...register(`sizes.${i}.topOffsetMm`, { valueAsNumber: true })}
              />
              <MoneyController control={control} name={`sizes.${i}.priceDiffMinor`} label="Price difference" currency={currency} error={e.sizes?.[i]?.priceDiffMinor?.message} />
              <TextField
                label="Chest or width (mm)"
                type="number"
                inputMode="decimal"
                hint={mmHint(v.sizes?.[i]?.chestMm)}
                error={e.sizes?.[i]?.chestMm?.message}
                {...register(`sizes.${i}.chestMm`, optionalMm)}
              />
              <TextField
                label="Length (mm)"
                type="number"
                inputMode="decimal"
                hint={mmHint(v.sizes?.[i]?.lengthMm)}
                error={e.sizes?.[i]?.lengthMm?.message}
                {...register(`sizes.${i}.lengthMm`, optionalMm)}
              />
            </div>
            {sizes.fields.length > 1 ? (
              <Button variant="quiet" className="self-start" onClick={() => sizes.remove(i)}>
                Remove size {v.sizes?.[i]?.label || i + 1}
              </Button>
            ) : null}
          </fieldset>
        ))}
        <p className="text-sm font-semibold text-danger">{e.sizes?.message ?? e.sizes?.root?.message}</p>
        {sizes.fields.length < MAX_BLANK_SIZES ? (
          <Button variant="secondary" className="self-start" onClick={() => sizes.append(newSize())}>
            Add a size
          </Button>
        ) : null}
      </FormSection>

      <FormSection title="Colours">
        {colours.fields.map((f, i) => (
          <div key={f.id} className="grid grid-cols-[1fr_auto] items-end gap-3 sm:grid-cols-[1fr_10rem_auto]">
            <TextField label={`Colour ${i + 1} name`} maxLength={40} error={e.colours?.[i]?.name?.message} {...register(`colours.${i}.name`)} />
            <TextField label="Colour" type="color" className="sm:w-40" error={e.colours?.[i]?.hex?.message} {...register(`colours.${i}.hex`)} />
            {colours.fields.length > 1 ? (
              <Button variant="quiet" onClick={() => colours.remove(i)}>
                Remove {v.colours?.[i]?.name || `colour ${i + 1}`}
              </Button>
            ) : null}
            {PhotoPicker ? (
              <details className="col-span-full text-sm">
                <summary className="cursor-pointer font-bold">Photo of {v.colours?.[i]?.name || `colour ${i + 1}`} (optional)</summary>
                <Controller
                  control={control}
                  name={`colours.${i}.photoId`}
                  render={({ field }) => (
                    <PhotoPicker max={1} value={field.value ? [field.value] : []} onChange={(ids) => field.onChange(ids.at(-1) ?? null)} error={e.colours?.[i]?.photoId?.message} />
                  )}
                />
              </details>
            ) : null}
          </div>
        ))}
        <p className="text-sm font-semibold text-danger">{e.colours?.message ?? e.colours?.root?.message}</p>
        {colours.fields.length < MAX_BLANK_COLOURS ? (
          <Button variant="secondary" className="self-start" onClick={() => colours.append(newColour())}>
            Add a colour
          </Button>
        ) : null}
      </FormSection>
      <Button variant="quiet" className="self-start" onClick={onDone}>
        Cancel
      </Button>
    </SubmitForm>
  );
}
