import type { BadgeTone } from '@/components/ui/badge';
import type { IconName } from '@/components/ui/icon';

/** IEC TS 62446-3 needs at least this irradiance in the module plane (c-Si) to judge an image. */
export const MIN_THERMOGRAPHY_IRRADIANCE_WM2 = 600;

/** ΔT the form shows while typing, K; null until both temperatures are numbers. */
export function previewDeltaT(hottestC: number | undefined, referenceC: number | undefined): number | null {
  if (hottestC === undefined || referenceC === undefined || !Number.isFinite(hottestC) || !Number.isFinite(referenceC)) return null;
  return Math.round((hottestC - referenceC) * 10) / 10;
}

export function isIrradianceTooLow(irradianceWm2: number | undefined): boolean {
  return irradianceWm2 !== undefined && Number.isFinite(irradianceWm2) && irradianceWm2 < MIN_THERMOGRAPHY_IRRADIANCE_WM2;
}

export type ClassView = { title: string; summary: string; tone: BadgeTone; icon: IconName };

/** How a class of abnormality reads: words first, icon and colour only back them up. */
export function classView(classOfAbnormality: number | null, isConditionsTooPoor: boolean): ClassView {
  if (isConditionsTooPoor || classOfAbnormality === null)
    return { title: 'Conditions too poor', summary: 'Not classified: repeat the image in steady sun above 600 W/m²', tone: 'attention', icon: 'alert' };
  if (classOfAbnormality >= 3) return { title: 'CoA 3', summary: 'Safety-relevant abnormality', tone: 'fail', icon: 'fail' };
  if (classOfAbnormality === 2) return { title: 'CoA 2', summary: 'Thermal abnormality', tone: 'attention', icon: 'alert' };
  return { title: 'CoA 1', summary: 'No abnormality', tone: 'pass', icon: 'check' };
}
