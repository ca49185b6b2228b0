'use client';

import { useActionState } from 'react';
import { saveProgramAction, type State } from '@/app/admin/program/actions';
import { Button } from '@/components/ui/button';
import { FieldError, TextArea, TextField } from '@/components/ui/text-field';
import type { ProgramIdentity } from '@/lib/program/settings';

export function ProgramForm({ program, timeZones }: { program: ProgramIdentity; timeZones: readonly string[] }) {
  const [state, action, pending] = useActionState<State, FormData>(saveProgramAction, {});
  const error = (field: string) => state.fields?.[field]?.[0];
  return (
    <form action={action} className="max-w-xl space-y-4" encType="multipart/form-data">
      <div aria-live="polite" id="program-form-message" className={state.ok ? 'font-semibold text-brine-700' : 'font-semibold text-beet-600'}>
        {state.message}
      </div>
      <TextField
        label="Program name"
        name="name"
        defaultValue={program.configured ? program.name : ''}
        placeholder={program.name}
        required
        maxLength={200}
        error={error('name')}
        hint="As it appears on certificates and the verification page."
      />
      <TextField
        label="Short name"
        name="shortName"
        defaultValue={program.shortName ?? ''}
        required
        maxLength={40}
        error={error('shortName')}
        hint="Shown in the header next to Brinewright."
      />
      <TextField
        label="Contact e-mail"
        name="contactEmail"
        type="email"
        defaultValue={program.contactEmail ?? ''}
        maxLength={254}
        error={error('contactEmail')}
      />
      <TextField label="Contact phone" name="contactPhone" type="tel" defaultValue={program.contactPhone ?? ''} maxLength={40} error={error('contactPhone')} />
      <TextArea
        label="Postal address"
        name="postalAddress"
        defaultValue={program.postalAddress ?? ''}
        maxLength={500}
        rows={3}
        error={error('postalAddress')}
      />
      <div className="space-y-1">
        <label htmlFor="program-time-zone" className="block text-sm font-semibold text-ink">
          Default time zone
        </label>
        <select
          id="program-time-zone"
          name="timeZone"
          defaultValue={program.timeZone}
          className="block w-full rounded-lg border border-ink-faint/40 bg-white px-3 py-2"
          aria-describedby={error('timeZone') ? 'program-time-zone-error' : undefined}
        >
          {timeZones.map((zone) => (
            <option key={zone} value={zone}>
              {zone}
            </option>
          ))}
        </select>
        <FieldError id="program-time-zone-error" message={error('timeZone')} />
      </div>
      <div className="space-y-1">
        <label htmlFor="program-logo" className="block text-sm font-semibold text-ink">
          Logo
        </label>
        <p id="program-logo-hint" className="text-sm text-ink-soft">
          PNG, JPEG or WebP up to 900 KB; it is re-encoded as a PNG of at most 256 pixels a side. Leave empty to keep the current one.
        </p>
        <input id="program-logo" name="logo" type="file" accept="image/png,image/jpeg,image/webp" aria-describedby="program-logo-hint" />
        <FieldError message={error('logo')} />
        {program.logoKey ? (
          // eslint-disable-next-line @next/next/no-img-element -- a small image from our own route, re-encoded on upload
          <img
            src={`/api/program/logo?v=${program.logoKey.slice(-24, -4)}`}
            alt="Current logo"
            className="mt-2 h-16 w-auto rounded border border-ink-faint/30 bg-white p-1"
          />
        ) : null}
      </div>
      <Button type="submit" pending={pending}>
        Save program settings
      </Button>
    </form>
  );
}
