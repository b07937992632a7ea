'use client';

import { useState } from 'react';
import { Button, LinkButton } from '@/components/ui/button';
import { NumberField } from '@/components/ui/field';
import { formatWhen, roundForDisplay } from '@/lib/bath/display';
import type { DoseRow } from '@/lib/bath/dose-rows';
import { floorQueue, newEntryKey, useEntryFate } from '@/lib/floor/browser-queue';
import type { UnitSystem } from '@/lib/plating/units';
import { AdditiveDoses } from '../../../_ui/additive-doses';
import { SaveState } from '../../../_ui/save-state';

type Props = {
  tank: { id: string; code: string };
  lastReading: { at: string; ampHours: number } | null;
  doses: DoseRow[];
  system: UnitSystem;
};

/** The rectifier's amp-hour meter as read now, and what the additives need with it. */
export function MeterEntry({ tank, lastReading, doses, system }: Props) {
  const [text, setText] = useState('');
  const [savedKey, setSavedKey] = useState<string | null>(null);
  const fate = useEntryFate(savedKey);
  const value = /^\d+(\.\d+)?$/.test(text.trim()) ? Number(text) : null;
  const lower = value !== null && lastReading && value < lastReading.ampHours;
  // A lower reading means the meter was reset: the new reading counts from zero.
  const added = value === null ? 0 : lastReading ? (lower ? value : value - lastReading.ampHours) : 0;
  const withNew = doses.map((d) => ({ ...d, kiloAmpHours: d.kiloAmpHours + added / 1000, doseL: d.doseL + ((added / 1000) * d.rateMlPerKAh) / 1000 }));

  function save() {
    if (value === null) return;
    const key = newEntryKey();
    setSavedKey(key);
    void floorQueue().add({
      key,
      payload: { kind: 'meter', key, tankId: tank.id, ampHours: value, readAt: new Date().toISOString(), note: lower ? 'Meter reset' : '' },
      label: `${tank.code} · meter ${value} A·h`,
    });
  }

  return (
    <div className="flex flex-col gap-5">
      {savedKey ? (
        <>
          <SaveState fate={fate} what="Meter reading" />
          <AdditiveDoses doses={withNew} system={system} />
          <div className="flex flex-wrap gap-3">
            <LinkButton size="lg" href={`/floor/tanks/${tank.code}/addition`}>Record an addition</LinkButton>
            <Button size="lg" variant="secondary" onClick={() => { setSavedKey(null); setText(''); }}>Another reading</Button>
          </div>
        </>
      ) : (
        <form className="flex flex-col gap-4" noValidate onSubmit={(e) => { e.preventDefault(); save(); }}>
          <p className="text-base text-ink-muted">
            {lastReading ? `Last reading ${lastReading.ampHours.toLocaleString('en-US')} A·h on ${formatWhen(lastReading.at)}.` : 'No reading yet on this tank.'}
          </p>
          <NumberField
            size="lg"
            label="Amp-hour meter reading"
            name="ampHours"
            unit="A·h"
            value={text}
            onChange={(e) => setText(e.target.value)}
            errors={text && value === null ? 'Give the meter reading as a number, e.g. 125400.' : null}
            inputClassName="text-3xl! py-3"
            autoFocus
          />
          {value !== null && lastReading ? (
            <p className="text-lg font-semibold text-ink tabular" aria-live="polite">
              {lower ? 'Lower than the last reading: taken as a meter reset. ' : ''}
              {roundForDisplay(added / 1000, 4)} kA·h since the last reading.
            </p>
          ) : null}
          <AdditiveDoses doses={withNew} system={system} />
          <Button type="submit" size="lg" fullWidth disabled={value === null}>Save meter reading</Button>
        </form>
      )}
    </div>
  );
}
