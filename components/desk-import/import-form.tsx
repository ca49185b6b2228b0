'use client';

import { useState, type FormEvent } from 'react';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Table, TBody, TD, TH, THead, TR } from '@/components/ui/table';
import { FetchError, errorMessage, postJson } from '@/lib/fetcher';
import type { ImportPreview } from '@/lib/import/holders';

type State = { step: 'upload' | 'preview' | 'done'; message?: string; preview?: ImportPreview; text?: string };

const OUTCOME = {
  create: { label: 'Will be created', tone: 'brine' },
  skip: { label: 'Skipped (duplicate)', tone: 'honey' },
  refuse: { label: 'Refused', tone: 'beet' },
} as const;

/** The holder import: the browser reads the CSV file and sends its text to preview, then to import (one transaction, or nothing). */
export function ImportForm() {
  const [current, setCurrent] = useState<State>({ step: 'upload' });
  const [busy, setBusy] = useState<'preview' | 'import' | null>(null);

  async function preview(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const file = new FormData(event.currentTarget).get('file');
    const text = file instanceof File && file.size > 0 ? await file.text() : '';
    if (!text) return setCurrent({ step: 'upload', message: 'Choose a CSV file to preview.' });
    setBusy('preview');
    try {
      const { preview } = await postJson<{ preview: ImportPreview }>('/api/desk/import/preview', { text });
      setCurrent({ step: 'preview', preview, text });
    } catch (error) {
      setCurrent({ step: 'upload', message: errorMessage(error, 'The file could not be previewed. Try again.') });
    } finally {
      setBusy(null);
    }
  }

  async function runImport(text: string) {
    setBusy('import');
    try {
      const { preview } = await postJson<{ preview: ImportPreview }>('/api/desk/import', { text });
      setCurrent({
        step: 'done',
        preview,
        message: `Imported ${preview.counts.create} certificate(s); ${preview.counts.skip} line(s) skipped as duplicates.`,
      });
    } catch (error) {
      // A line refused since the preview: the server sends the new preview with its sentence.
      const again = error instanceof FetchError ? (error.body.preview as ImportPreview | undefined) : undefined;
      setCurrent({ step: 'preview', preview: again ?? current.preview, text, message: errorMessage(error, 'The import did not run. Try again.') });
    } finally {
      setBusy(null);
    }
  }

  const lines = current.preview?.lines ?? [];
  const counts = current.preview?.counts;
  return (
    <div className="space-y-6">
      <form onSubmit={preview} className="space-y-3">
        <label htmlFor="import-file" className="block text-sm font-semibold">
          CSV file of certificate holders
        </label>
        <input id="import-file" name="file" type="file" accept=".csv,text/csv" required aria-describedby="import-help" />
        <p id="import-help" className="text-sm text-ink-soft">
          First line: name, email, course, certificate_date, end_date, old_serial (old_serial may be empty). Dates as YYYY-MM-DD; course as its short name, e.g.
          pickling-and-canning.
        </p>
        <Button type="submit" variant="secondary" pending={busy === 'preview'}>
          Preview the import
        </Button>
      </form>
      <div aria-live="polite" className="font-semibold" data-testid="import-message">
        {current.message}
      </div>
      {counts ? (
        <section aria-labelledby="preview-heading" className="space-y-3">
          <h2 id="preview-heading" className="text-xl font-bold">
            {current.step === 'done' ? 'Imported' : 'Preview'}: {counts.create} to create, {counts.skip} skipped, {counts.refuse} refused
          </h2>
          <Table caption="Each line of the file and what happens to it">
            <THead>
              <TR>
                <TH>Line</TH>
                <TH>Name</TH>
                <TH>E-mail</TH>
                <TH>Course</TH>
                <TH>Outcome</TH>
              </TR>
            </THead>
            <TBody>
              {lines.map((l) => (
                <TR key={l.line}>
                  <TD>{l.line}</TD>
                  <TD>{l.name}</TD>
                  <TD>{l.email}</TD>
                  <TD>{l.course}</TD>
                  <TD>
                    <Badge tone={OUTCOME[l.outcome].tone}>{OUTCOME[l.outcome].label}</Badge>
                    {l.outcome === 'create' && l.newAccount ? <span className="ml-2 text-sm">new account</span> : null}
                    {l.reason ? <span className="block text-sm">{l.reason}</span> : null}
                  </TD>
                </TR>
              ))}
            </TBody>
          </Table>
          {current.step === 'preview' && counts.refuse === 0 && counts.create > 0 ? (
            <Button type="button" pending={busy === 'import'} onClick={() => runImport(current.text ?? '')}>
              Import {counts.create} certificate{counts.create === 1 ? '' : 's'}
            </Button>
          ) : null}
          {current.step === 'preview' && counts.refuse > 0 ? (
            <p>Correct the refused lines in the file and preview it again: nothing is imported while a line is refused.</p>
          ) : null}
        </section>
      ) : null}
    </div>
  );
}
