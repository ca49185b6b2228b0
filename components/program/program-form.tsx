'use client';

import { useRouter } from 'next/navigation';
import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { FieldError, TextArea, TextField } from '@/components/ui/text-field';
import { FetchError, errorMessage, postForm, postJson } from '@/lib/fetcher';
import type { ProgramIdentity } from '@/lib/program/settings';

type State = { ok?: boolean; message?: string; fields?: Record<string, string[]> };
const FIELDS = ['name', 'shortName', 'contactEmail', 'contactPhone', 'postalAddress', 'timeZone'] as const;

/** The admin's program page: the fields as JSON to /api/program, then a chosen logo as a multipart upload to /api/program/logo. */
export function ProgramForm({ program, timeZones }: { program: ProgramIdentity; timeZones: readonly string[] }) {
  const router = useRouter();
  const [state, setState] = useState<State>({});
  const [pending, setPending] = useState(false);
  const error = (field: string) => state.fields?.[field]?.[0];

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const logo = form.get('logo');
    setPending(true);
    let saved = false;
    try {
      await postJson('/api/program', Object.fromEntries(FIELDS.map((f) => [f, String(form.get(f) ?? '')])));
      saved = true;
      if (logo instanceof File && logo.size > 0) {
        const upload = new FormData();
        upload.set('logo', logo);
        await postForm('/api/program/logo', upload);
      }
      setState({ ok: true, message: 'Program settings saved.' });
      router.refresh();
    } catch (e) {
      const fields = e instanceof FetchError ? e.fields : undefined;
      const problem =
        fields && Object.keys(fields).length ? 'Please check the fields marked below.' : errorMessage(e, 'The settings could not be saved. Try again.');
      setState({ message: saved ? `The settings were saved; the logo was not. ${problem}` : problem, fields });
      if (saved) router.refresh();
    } finally {
      setPending(false);
    }
  }

  return (
    <form onSubmit={onSubmit} noValidate className="max-w-xl space-y-4" aria-describedby="program-form-message">
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
