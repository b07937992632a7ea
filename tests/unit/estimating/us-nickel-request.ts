// One nickel job asked for in US units, and what the engine makes of it when fed the same job in
// storage units by hand. Shared by the unit and the integration tests of the estimate route.
import { estimateJob } from '@/lib/plating';

export const US_NICKEL_REQUEST = {
  area: { value: 12.5, unit: 'in2' },
  thickness: { value: 0.3, unit: 'mil' },
  currentDensity: { value: 20, unit: 'A/ft2' },
  element: 'Ni',
  charge: 2,
  efficiency: 0.95,
  quantity: 500,
  partsPerLoad: 50,
  rectifierMaxA: 500,
} as const;

export function usNickelByHand() {
  // Source: NIST SP 811 App. B.8: 1 in² = 0.064516 dm², 1 mil = 25.4 µm, 1 ft² = 9.290304 dm².
  return estimateJob({
    areaPerPartDm2: 12.5 * 0.064516,
    quantity: 500,
    minimumThicknessUm: 0.3 * 25.4,
    process: {
      element: 'Ni', charge: 2, currentDensityAdm2: 20 / 9.290304, efficiency: 0.95, loading: 'rack', partsPerLoad: 50,
      // The route's documented defaults for what the request leaves out.
      tankVolts: 6, rectifierMaxA: 500, rectifierEfficiency: 0.85, dragOutLPerM2: 0.05, bathMetalGPerL: 0,
    },
  });
}
