/** The serial box: a plain GET form, so it works without JavaScript. */
export function SerialForm() {
  return (
    <form action="/verify" method="get" className="flex flex-wrap items-end gap-3">
      <div className="min-w-60 flex-1 space-y-1">
        <label htmlFor="serial" className="block text-sm font-semibold">
          Certificate serial
        </label>
        <p id="serial-hint" className="text-sm text-ink-soft">
          16 characters, for example K7QM-4TZP-XR9D-2HWC. Case and hyphens do not matter.
        </p>
        <input
          id="serial"
          name="serial"
          required
          maxLength={40}
          autoComplete="off"
          spellCheck={false}
          aria-describedby="serial-hint"
          className="block w-full rounded-lg border border-ink-faint/40 bg-white px-3 py-2 font-mono uppercase shadow-inner focus:border-brine-600 focus:outline-2 focus:outline-brine-300"
        />
      </div>
      <button type="submit" className="rounded-lg bg-copper-600 px-4 py-2.5 font-semibold text-white hover:bg-copper-700">
        Check
      </button>
    </form>
  );
}
