import { InstrumentsPage } from '@/features/field-checks/components/instruments-page';

/** `/instruments`: the instrument register and calibration dates. */
export function InstrumentsRoute() {
  return <InstrumentsPage />;
}
