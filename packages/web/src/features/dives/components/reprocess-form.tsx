import { zodResolver } from '@hookform/resolvers/zod';
import { useId } from 'react';
import { useForm } from 'react-hook-form';
import { buttonStyles } from '../../../components/ui/button-styles';
import { FormFailure } from '../../../components/ui/form-failure';
import { SelectField } from '../../../components/ui/select-field';
import { TextField } from '../../../components/ui/text-field';
import type { ReprocessRequest } from '../api/reprocess-dive';
import {
  defaultReprocessValues,
  PRESET_PROFILES,
  type ReprocessFormValues,
  reprocessFormSchema,
  toReprocessRequest,
} from '../lib/reprocess-form-schema';

/** Props of the reprocess form. */
export interface ReprocessFormProps {
  /** The profile the dive was last audited with (preselected). */
  currentProfile: string;
  onSubmit: (request: ReprocessRequest) => void | Promise<void>;
  /** True while a request is being sent or its run is still going. */
  busy?: boolean;
  /** Why the last request failed. */
  error?: unknown;
}

function RadioRow<T extends string>({
  legend,
  name,
  options,
  register,
}: {
  legend: string;
  name: keyof ReprocessFormValues;
  options: readonly { value: T; label: string }[];
  register: ReturnType<typeof useForm<ReprocessFormValues>>['register'];
}) {
  return (
    <fieldset className="flex flex-col gap-1">
      <legend className="font-medium">{legend}</legend>
      <div className="flex flex-wrap gap-x-4 gap-y-1">
        {options.map((option) => (
          <label key={option.value} className="flex items-center gap-1 text-sm">
            <input type="radio" value={option.value} className="accent-kelp" {...register(name)} />
            {option.label}
          </label>
        ))}
      </div>
    </fieldset>
  );
}

/**
 * Reprocess a dive: another audit profile, and optionally a re-solve with a corrected setup (sound
 * speed or temperature and salinity, heading offset, declination from the World Magnetic Model or
 * typed, lever arm, transceiver draft, a fixed surveyed surface position).
 */
export function ReprocessForm({ currentProfile, onSubmit, busy = false, error }: ReprocessFormProps) {
  const id = useId();
  const {
    register,
    handleSubmit,
    watch,
    formState: { errors },
  } = useForm<ReprocessFormValues>({
    resolver: zodResolver(reprocessFormSchema),
    defaultValues: defaultReprocessValues(currentProfile),
    mode: 'onTouched',
  });
  const resolve = watch('resolve');
  const waterMethod = watch('waterMethod');
  const declinationMethod = watch('declinationMethod');
  const surfaceMethod = watch('surfaceMethod');
  const profiles = PRESET_PROFILES.includes(currentProfile as (typeof PRESET_PROFILES)[number])
    ? PRESET_PROFILES
    : [currentProfile, ...PRESET_PROFILES];
  const submit = handleSubmit(async (values) => {
    await onSubmit(toReprocessRequest(values));
  });
  return (
    <form onSubmit={submit} noValidate aria-label="Reprocess the dive" className="flex flex-col gap-4">
      <SelectField label="Audit profile" error={errors.auditProfile?.message} {...register('auditProfile')}>
        {profiles.map((profile) => (
          <option key={profile} value={profile}>
            {profile}
          </option>
        ))}
      </SelectField>
      <label className="flex items-start gap-2">
        <input type="checkbox" className="mt-1 size-4 accent-kelp" {...register('resolve')} />
        <span>
          <span className="font-medium">Re-solve the positions with a corrected setup</span>
          <span className="block text-sm text-abyss-soft">
            Recomputes each fix from slant range, bearing and depth. Leave it off to audit the logged positions again.
          </span>
        </span>
      </label>
      {resolve ? (
        <div className="flex flex-col gap-4 border-l-2 border-kelp/40 pl-4">
          <TextField
            label="Logged sound speed (m/s)"
            hint="The speed the system used when it logged the slant ranges."
            inputMode="decimal"
            error={errors.loggedSoundSpeedMps?.message}
            {...register('loggedSoundSpeedMps')}
          />
          <RadioRow
            legend="Sound speed in the water"
            name="waterMethod"
            register={register}
            options={[
              { value: 'none', label: 'As logged' },
              { value: 'value', label: 'A measured speed' },
              { value: 'temperature-salinity', label: 'From temperature and salinity' },
            ]}
          />
          {waterMethod === 'value' ? (
            <TextField
              label="Water sound speed (m/s)"
              inputMode="decimal"
              error={errors.waterSoundSpeedMps?.message}
              {...register('waterSoundSpeedMps')}
            />
          ) : null}
          {waterMethod === 'temperature-salinity' ? (
            <div className="grid gap-3 sm:grid-cols-2">
              <TextField
                label="Temperature (°C)"
                inputMode="decimal"
                error={errors.temperatureC?.message}
                {...register('temperatureC')}
              />
              <TextField
                label="Salinity (PSU)"
                hint="0 for fresh water."
                inputMode="decimal"
                error={errors.salinityPsu?.message}
                {...register('salinityPsu')}
              />
            </div>
          ) : null}
          <div className="grid gap-3 sm:grid-cols-2">
            <SelectField label="Bearings measured from" {...register('bearingReference')}>
              <option value="from-log">What the log says</option>
              <option value="relative">The surface unit's heading (relative)</option>
              <option value="true">True north</option>
              <option value="magnetic">Magnetic north</option>
            </SelectField>
            <TextField
              label="Heading offset (°)"
              hint="Added to the logged heading, clockwise."
              inputMode="decimal"
              error={errors.headingOffsetDeg?.message}
              {...register('headingOffsetDeg')}
            />
          </div>
          <RadioRow
            legend="Magnetic declination"
            name="declinationMethod"
            register={register}
            options={[
              { value: 'wmm', label: 'Automatic (World Magnetic Model)' },
              { value: 'value', label: 'Typed in' },
            ]}
          />
          {declinationMethod === 'value' ? (
            <TextField
              label="Declination (° east)"
              hint="0 when the logged heading is already true."
              inputMode="decimal"
              error={errors.declinationDeg?.message}
              {...register('declinationDeg')}
            />
          ) : null}
          <fieldset className="flex flex-col gap-2">
            <legend className="font-medium">Lever arm, GNSS antenna to transceiver (m)</legend>
            <div className="grid gap-3 sm:grid-cols-3">
              <TextField
                label="Forward (x)"
                inputMode="decimal"
                error={errors.leverArmForwardM?.message}
                {...register('leverArmForwardM')}
              />
              <TextField
                label="Starboard (y)"
                inputMode="decimal"
                error={errors.leverArmStarboardM?.message}
                {...register('leverArmStarboardM')}
              />
              <TextField
                label="Down (z)"
                inputMode="decimal"
                error={errors.leverArmDownM?.message}
                {...register('leverArmDownM')}
              />
            </div>
          </fieldset>
          <TextField
            label="Transceiver draft (m)"
            inputMode="decimal"
            error={errors.transceiverDraftM?.message}
            {...register('transceiverDraftM')}
          />
          <RadioRow
            legend="Surface unit position"
            name="surfaceMethod"
            register={register}
            options={[
              { value: 'gnss', label: 'Its logged GNSS fixes' },
              { value: 'fixed', label: 'A fixed surveyed position' },
            ]}
          />
          {surfaceMethod === 'fixed' ? (
            <div className="grid gap-3 sm:grid-cols-2">
              <TextField
                label="Latitude (° WGS 84)"
                inputMode="decimal"
                error={errors.surfaceLatDeg?.message}
                {...register('surfaceLatDeg')}
              />
              <TextField
                label="Longitude (° WGS 84)"
                inputMode="decimal"
                error={errors.surfaceLonDeg?.message}
                {...register('surfaceLonDeg')}
              />
            </div>
          ) : null}
        </div>
      ) : null}
      <FormFailure error={error} id={`${id}-failure`} />
      <div>
        <button type="submit" className={buttonStyles('primary', 'min-h-10')} disabled={busy}>
          {busy ? 'Reprocessing…' : 'Reprocess the dive'}
        </button>
      </div>
    </form>
  );
}
