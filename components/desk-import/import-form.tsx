'use client';

import { useActionState } from 'react';
import { importAction, previewImportAction, type State } from '@/app/desk/import/actions';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Table, TBody, TD, TH, THead, TR } from '@/components/ui/table';

const OUTCOME = {
  create: { label: 'Will be created', tone: 'brine' },
  skip: { label: 'Skipped (duplicate)', tone: 'honey' },
  refuse: { label: 'Refused', tone: 'beet' },
} as const;

export function ImportForm() {
  const [previewed, preview, previewing] = useActionState<State, FormData>(previewImportAction, { step: 'upload' });
  const [imported, runImport, importing] = useActionState<State, FormData>(importAction, { step: 'upload' });
  const current = imported.step !== 'upload' || imported.message ? imported : previewed;
  const lines = current.preview?.lines ?? [];
  const counts = current.preview?.counts;
  return (
    <div className="space-y-6">
      <form action={preview} className="space-y-3">
        <label htmlFor="import-file" className="block text-sm font-semibold">
          CSV file of certificate holders
        </label>
        <input id="import-file" name="file" type="file" accept=".csv,text/csv" required aria-describedby="import-help" />
        <p id="import-help" className="text-sm text-ink-soft">
          First line: name, email, course, certificate_date, end_date, old_serial (old_serial may be empty). Dates as YYYY-MM-DD; course as its short name, e.g.
          pickling-and-canning.
        </p>
        <Button type="submit" variant="secondary" pending={previewing}>
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
            <form action={runImport}>
              <input type="hidden" name="text" value={current.text ?? ''} />
              <Button type="submit" pending={importing}>
                Import {counts.create} certificate{counts.create === 1 ? '' : 's'}
              </Button>
            </form>
          ) : null}
          {current.step === 'preview' && counts.refuse > 0 ? (
            <p>Correct the refused lines in the file and preview it again: nothing is imported while a line is refused.</p>
          ) : null}
        </section>
      ) : null}
    </div>
  );
}
