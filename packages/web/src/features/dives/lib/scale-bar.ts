import { niceStep } from './nice-ticks';

/** The longest 1-2-5 length that fits in `maxPx` at the given scale, with its width in px and a label. */
export function chooseScaleBar(metresPerPx: number, maxPx = 120): { lengthM: number; widthPx: number; label: string } {
  const rough = metresPerPx * maxPx;
  let lengthM = niceStep(rough);
  if (lengthM > rough) {
    // niceStep rounds up; step down one 1-2-5 notch to fit.
    const power = 10 ** Math.floor(Math.log10(lengthM));
    const lead = Math.round(lengthM / power);
    lengthM = lead === 1 ? power / 2 : lead === 2 ? power : lead === 5 ? 2 * power : 5 * power;
  }
  const label =
    lengthM >= 1000 ? `${lengthM / 1000} km` : lengthM >= 1 ? `${lengthM} m` : `${Math.round(lengthM * 100)} cm`;
  return { lengthM, widthPx: lengthM / metresPerPx, label };
}
