import type { ComponentType, ReactNode } from 'react';
import { type Control, Controller, type FieldErrors, type UseFormRegister, type UseFormSetValue, useFieldArray, useWatch } from 'react-hook-form';
import type { FontInfo } from '../../../../shared/schemas/engine.ts';
import type { ListingInput } from '../../../../shared/schemas/listing.ts';
import type { Material } from '../../../../shared/schemas/material.ts';
import { formatSmallLength } from '../../../../shared/units.ts';
import { Button } from '../../../components/ui/button.tsx';
import { CheckboxField, FieldError, FormSection, SelectField } from '../../../components/ui/form-controls.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { ColourChoices, FontChoices } from './choice-chips.tsx';

/** What the editor needs to know about one of the shop's motifs. */
export type EditorMotif = { id: string; name: string; layers: { id: string; colour: string | null }[] };
export type MotifPreviewProps = { motifId: string; colours?: Record<string, string>; showLayers?: boolean; size?: 'sm' | 'md' };

type Props = {
  control: Control<ListingInput>;
  register: UseFormRegister<ListingInput>;
  setValue: UseFormSetValue<ListingInput>;
  errors: FieldErrors<ListingInput>;
  fonts: FontInfo[];
  materials: Material[];
  motifs: EditorMotif[];
  MotifPreview: ComponentType<MotifPreviewProps>;
  motifUpload: ReactNode;
};

const msg = (e: unknown): string | undefined => {
  if (!e || typeof e !== 'object') return undefined;
  const o = e as { message?: string; root?: { message?: string } };
  return o.message ?? o.root?.message;
};
const lh = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) && v > 0 ? formatSmallLength(v) : '\u00a0');

export function PersonalisationEditor(props: Props) {
  const { errors } = props;
  return (
    <>
      <TextFieldsEditor {...props} />
      <MotifsEditor {...props} />
      <OutlineEditor {...props} />
      <FieldError message={msg(errors.personalisation)} />
    </>
  );
}

function TextFieldsEditor({ control, register, errors, fonts, materials }: Props) {
  const { fields, append, remove } = useFieldArray({ control, name: 'personalisation.textFields' });
  const tf = useWatch({ control, name: 'personalisation.textFields' }) ?? [];
  const e = errors.personalisation?.textFields;
  return (
    <FormSection title="Text the shopper types" lead="Usually the child's name. Each field is cut in one of the colours you offer.">
      {fields.map((f, i) => {
        const fe = e?.[i];
        const allowed = tf[i]?.fontIds ?? [];
        return (
          <fieldset key={f.id} className="flex min-w-0 flex-col gap-4 rounded-lg bg-paper p-4" aria-label={`Text field ${i + 1}`}>
            <div className="flex items-center justify-between gap-3">
              <h3 className="font-extrabold">Text field {i + 1}</h3>
              <Button variant="quiet" onClick={() => remove(i)}>
                Remove<span className="sr-only"> text field {i + 1}</span>
              </Button>
            </div>
            <div className="grid grid-cols-1 gap-4 sm:grid-cols-3">
              <TextField label="Label" hint="What the shopper sees, e.g. “Name”." maxLength={60} error={fe?.label?.message} {...register(`personalisation.textFields.${i}.label`)} />
              <TextField
                label="Short id"
                hint="Lower-case, used on orders."
                maxLength={32}
                spellCheck={false}
                autoCapitalize="none"
                error={fe?.id?.message}
                {...register(`personalisation.textFields.${i}.id`)}
              />
              <TextField
                label="Max length"
                hint="Characters."
                type="number"
                inputMode="numeric"
                min={1}
                max={40}
                error={fe?.maxLength?.message}
                {...register(`personalisation.textFields.${i}.maxLength`, { valueAsNumber: true })}
              />
            </div>
            <Controller
              control={control}
              name={`personalisation.textFields.${i}.fontIds`}
              render={({ field }) => <FontChoices fonts={fonts} value={field.value} onChange={field.onChange} error={msg(fe?.fontIds)} />}
            />
            <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
              <SelectField label="Default font" error={fe?.defaultFontId?.message} {...register(`personalisation.textFields.${i}.defaultFontId`, { setValueAs: (v: string) => v || undefined })}>
                {allowed.length === 0 ? <option value="">Allow a font first</option> : null}
                {fonts
                  .filter((x) => allowed.includes(x.id as never))
                  .map((x) => (
                    <option key={x.id} value={x.id}>
                      {x.family}
                    </option>
                  ))}
              </SelectField>
              <TextField
                label="Default letter height (mm)"
                hint={lh(tf[i]?.defaultLetterHeightMm)}
                type="number"
                inputMode="decimal"
                min={5}
                max={200}
                error={fe?.defaultLetterHeightMm?.message}
                {...register(`personalisation.textFields.${i}.defaultLetterHeightMm`, { valueAsNumber: true })}
              />
            </div>
            <Controller
              control={control}
              name={`personalisation.textFields.${i}.colourChoices`}
              render={({ field }) => (
                <ColourChoices label="Colours offered" hint="The first one is preselected." materials={materials} value={field.value} onChange={field.onChange} error={msg(fe?.colourChoices)} />
              )}
            />
            <CheckboxField label="The shopper must fill this in" {...register(`personalisation.textFields.${i}.required`)} />
          </fieldset>
        );
      })}
      <FieldError message={msg(e)} />
      {fields.length < 4 ? (
        <Button
          variant="secondary"
          className="self-start"
          onClick={() => {
            const taken = new Set(tf.map((x) => x?.id));
            const id = !taken.has('name') ? 'name' : `text-${fields.length + 1}`;
            append({
              id,
              label: fields.length === 0 ? 'Name' : `Line ${fields.length + 1}`,
              maxLength: 12,
              fontIds: fonts[0] ? [fonts[0].id as never] : [],
              defaultFontId: (fonts[0]?.id as never) ?? undefined,
              defaultLetterHeightMm: 50,
              required: true,
              colourChoices: materials[0] ? [materials[0].id] : [],
            });
          }}
        >
          Add a text field
        </Button>
      ) : null}
    </FormSection>
  );
}

function MotifsEditor({ control, register, errors, materials, motifs, MotifPreview, motifUpload }: Props) {
  const { fields, append, remove } = useFieldArray({ control, name: 'personalisation.motifChoices' });
  const mc = useWatch({ control, name: 'personalisation.motifChoices' }) ?? [];
  const e = errors.personalisation?.motifChoices;
  const offered = new Set(mc.map((m) => m?.motifId));
  const available = motifs.filter((m) => !offered.has(m.id));
  const hex = (id: string | undefined) => materials.find((m) => m.id === id)?.colourHex;

  return (
    <FormSection title="Motifs" lead="Layered artwork the shopper can pick. Map each layer to one of your materials, or let the shopper choose its colour.">
      {fields.map((f, i) => {
        const choice = mc[i];
        const motif = motifs.find((m) => m.id === choice?.motifId);
        const me = e?.[i];
        const colours: Record<string, string> = {};
        for (const l of choice?.layers ?? []) {
          const h = l?.mode === 'fixed' ? hex(l.materialId) : hex(l?.colourChoices?.[0]);
          if (l?.layerId && h) colours[l.layerId] = h;
        }
        return (
          <fieldset key={f.id} aria-label={`Motif ${i + 1}`} className="flex min-w-0 flex-col gap-4 rounded-lg bg-paper p-4">
            <div className="flex items-center justify-between gap-3">
              <h3 className="font-extrabold">{motif?.name ?? 'Motif'}</h3>
              <Button variant="quiet" onClick={() => remove(i)}>
                Remove<span className="sr-only"> motif {motif?.name}</span>
              </Button>
            </div>
            <FieldError message={me?.motifId?.message} />
            {choice?.motifId ? <MotifPreview motifId={choice.motifId} colours={colours} /> : null}
            <TextField label="Name shown to shoppers" maxLength={60} error={me?.label?.message} {...register(`personalisation.motifChoices.${i}.label`)} />
            <ol className="flex flex-col gap-4">
              {(choice?.layers ?? []).map((l, j) => {
                const le = me?.layers?.[j];
                return (
                  <li key={l?.layerId ?? j} className="flex flex-col gap-3 rounded-lg border border-line bg-white p-3">
                    <p className="font-bold">
                      Layer {j + 1} (bottom → top): {l?.layerId}
                    </p>
                    <fieldset className="flex flex-wrap gap-4">
                      <legend className="sr-only">How layer {l?.layerId} is coloured</legend>
                      <label className="flex min-h-11 items-center gap-2">
                        <input type="radio" value="shopper" className="size-5 accent-thread" {...register(`personalisation.motifChoices.${i}.layers.${j}.mode`)} />
                        The shopper picks the colour
                      </label>
                      <label className="flex min-h-11 items-center gap-2">
                        <input type="radio" value="fixed" className="size-5 accent-thread" {...register(`personalisation.motifChoices.${i}.layers.${j}.mode`)} />
                        Always one material
                      </label>
                    </fieldset>
                    {l?.mode === 'fixed' ? (
                      <SelectField
                        label={`Material for ${l.layerId}`}
                        error={le?.materialId?.message}
                        {...register(`personalisation.motifChoices.${i}.layers.${j}.materialId`, { setValueAs: (v: string) => v || undefined })}
                      >
                        <option value="">Pick a material</option>
                        {materials.map((m) => (
                          <option key={m.id} value={m.id}>
                            {m.colourName} ({m.kind})
                          </option>
                        ))}
                      </SelectField>
                    ) : (
                      <Controller
                        control={control}
                        name={`personalisation.motifChoices.${i}.layers.${j}.colourChoices`}
                        render={({ field }) => (
                          <ColourChoices label={`Colours offered for ${l?.layerId}`} materials={materials} value={field.value} onChange={field.onChange} error={msg(le?.colourChoices)} />
                        )}
                      />
                    )}
                  </li>
                );
              })}
            </ol>
            <FieldError message={msg(me?.layers)} />
          </fieldset>
        );
      })}
      <FieldError message={msg(e)} />
      {available.length > 0 && fields.length < 12 ? (
        <SelectField
          label="Offer one of your motifs"
          value=""
          onChange={(ev) => {
            const m = motifs.find((x) => x.id === ev.target.value);
            if (!m) return;
            append({
              motifId: m.id,
              label: m.name,
              layers: m.layers.slice(0, 4).map((l, k) => ({ layerId: l.id, mode: 'shopper' as const, colourChoices: materials[k] ? [materials[k]!.id] : [] })),
            });
          }}
        >
          <option value="">Choose a motif…</option>
          {available.map((m) => (
            <option key={m.id} value={m.id}>
              {m.name} ({m.layers.length} layer{m.layers.length === 1 ? '' : 's'})
            </option>
          ))}
        </SelectField>
      ) : null}
      {motifUpload}
      <CheckboxField label="The shopper must pick a motif" {...register('personalisation.motifRequired')} />
      <FieldError message={errors.personalisation?.motifRequired?.message} />
    </FormSection>
  );
}

function OutlineEditor({ control, register, setValue, errors, materials }: Props) {
  const outline = useWatch({ control, name: 'personalisation.outline' });
  const e = errors.personalisation?.outline;
  return (
    <FormSection title="Outline layer" lead="An optional layer cut around the whole design, pressed first (bottom).">
      <CheckboxField
        label="Offer an outline"
        checked={Boolean(outline)}
        onChange={(ev) => setValue('personalisation.outline', ev.target.checked ? { offsetMm: 3, colourChoices: materials[0] ? [materials[0].id] : [] } : null, { shouldDirty: true })}
      />
      {outline ? (
        <>
          <TextField
            label="Outline offset (mm)"
            hint={lh(outline.offsetMm)}
            type="number"
            inputMode="decimal"
            min={1}
            max={15}
            className="max-w-xs"
            error={e?.offsetMm?.message}
            {...register('personalisation.outline.offsetMm', { valueAsNumber: true })}
          />
          <Controller
            control={control}
            name="personalisation.outline.colourChoices"
            render={({ field }) => <ColourChoices label="Outline colours offered" materials={materials} value={field.value} onChange={field.onChange} error={msg(e?.colourChoices)} />}
          />
        </>
      ) : null}
    </FormSection>
  );
}
