import { useState } from 'react';
import { MultiStartPanel } from './MultiStartPanel';
import { CriticalPointsPanel } from './CriticalPointsPanel';
import { RateSweepPanel } from './RateSweepPanel';
import { SharpnessPanel } from './SharpnessPanel';
import { StartMapPanel } from './StartMapPanel';

const KINDS = [
  ['map', 'Start-point map'],
  ['multi', 'Multi-start'],
  ['rates', 'Learning-rate sweep'],
  ['sharpness', 'Sharpness'],
  ['critical', 'Critical points'],
] as const;

/** The studies below the results: how the outcome depends on the start point and the learning rate. One shown at a time. */
export function StudyArea() {
  const [kind, setKind] = useState<(typeof KINDS)[number][0]>('map');
  return (
    <div className="study-area">
      <div role="tablist" aria-label="Studies" className="study-tabs">
        {KINDS.map(([k, label]) => (
          <button key={k} type="button" role="tab" aria-selected={kind === k} onClick={() => setKind(k)}>
            {label}
          </button>
        ))}
      </div>
      {kind === 'map' && <StartMapPanel />}
      {kind === 'multi' && <MultiStartPanel />}
      {kind === 'rates' && <RateSweepPanel />}
      {kind === 'sharpness' && <SharpnessPanel />}
      {kind === 'critical' && <CriticalPointsPanel />}
    </div>
  );
}
