import { cellTemperature } from '@stringfield/pv';

// Where the sun stands over each demo site, so that demo readings fall in daylight at a plausible hour
// and season for the site's time zone. The coordinates are invented points in each site's time zone
// (used only here, never shown); tilt is the invented module tilt. Clear-sky values only: a
// Meinel-type beam model with a fixed diffuse share, good to a few per cent for placing demo data,
// not for any check.
type Sky = { latDeg: number; lonDeg: number; tiltDeg: number; winterHighC: number; summerHighC: number };

export const demoSky: Record<string, Sky> = {
  FWM: { latDeg: 53.1, lonDeg: 9.6, tiltDeg: 35, winterHighC: 3, summerHighC: 22 },
  OSR: { latDeg: 53.4, lonDeg: -113.2, tiltDeg: 35, winterHighC: -9, summerHighC: 22 },
  CBD: { latDeg: 48.1, lonDeg: 16.2, tiltDeg: 15, winterHighC: 2, summerHighC: 26 },
};

const rad = Math.PI / 180;

function sun(sky: Sky, at: Date) {
  const start = Date.UTC(at.getUTCFullYear(), 0, 1);
  const hourUtc = at.getUTCHours() + at.getUTCMinutes() / 60;
  const g = ((2 * Math.PI) / 365) * ((at.getTime() - start) / 86_400_000 - 0.5);
  // NOAA solar-position series (equation of time in minutes, declination in radians).
  const eqTimeMin = 229.18 * (0.000075 + 0.001868 * Math.cos(g) - 0.032077 * Math.sin(g) - 0.014615 * Math.cos(2 * g) - 0.040849 * Math.sin(2 * g));
  const decl =
    0.006918 - 0.399912 * Math.cos(g) + 0.070257 * Math.sin(g) - 0.006758 * Math.cos(2 * g) + 0.000907 * Math.sin(2 * g) - 0.002697 * Math.cos(3 * g) + 0.00148 * Math.sin(3 * g);
  const solarHour = (hourUtc * 60 + eqTimeMin + 4 * sky.lonDeg) / 60;
  const hourAngle = (solarHour - 12) * 15 * rad;
  const lat = sky.latDeg * rad;
  const cosZenith = Math.sin(lat) * Math.sin(decl) + Math.cos(lat) * Math.cos(decl) * Math.cos(hourAngle);
  const tilt = sky.tiltDeg * rad;
  // South-facing plane in the northern hemisphere.
  const cosIncidence = Math.sin(decl) * Math.sin(lat - tilt) + Math.cos(decl) * Math.cos(lat - tilt) * Math.cos(hourAngle);
  return { cosZenith, cosIncidence, solarHour: ((solarHour % 24) + 24) % 24, dayOfYear: (at.getTime() - start) / 86_400_000 };
}

/** Clear-sky plane-of-array irradiance, W/m², at a demo site at a moment. */
export function clearSkyPoaWm2(site: string, at: Date): number {
  const sky = demoSky[site]!;
  const s = sun(sky, at);
  if (s.cosZenith <= 0.05) return 0;
  const zenithDeg = Math.acos(s.cosZenith) / rad;
  const airMass = 1 / (s.cosZenith + 0.50572 * (96.07995 - zenithDeg) ** -1.6364); // Kasten–Young
  const dni = 1361 * 0.7 ** (airMass ** 0.678); // Meinel
  const dhi = 0.14 * dni;
  const ghi = dni * s.cosZenith + dhi;
  const tilt = sky.tiltDeg * rad;
  const poa = dni * Math.max(0, s.cosIncidence) + (dhi * (1 + Math.cos(tilt))) / 2 + (0.2 * ghi * (1 - Math.cos(tilt))) / 2;
  return 0.93 * poa; // a little haze
}

/** The clear-sky irradiance at the site's solar noon of the same day, W/m². */
export function noonPoaWm2(site: string, at: Date): number {
  const s = sun(demoSky[site]!, at);
  return clearSkyPoaWm2(site, new Date(at.getTime() + (12 - s.solarHour) * 3_600_000));
}

/** Ambient air temperature, °C: a seasonal afternoon high with a simple daily swing. */
export function ambientC(site: string, at: Date): number {
  const sky = demoSky[site]!;
  const s = sun(sky, at);
  const season = (1 - Math.cos((2 * Math.PI * (s.dayOfYear - 20)) / 365)) / 2; // 0 mid-January, 1 mid-July
  const high = sky.winterHighC + (sky.summerHighC - sky.winterHighC) * season;
  return high - 3.5 * (1 - Math.cos((2 * Math.PI * (s.solarHour - 15)) / 24));
}

/** Module temperature a back-of-module probe would read, °C (NOCT model of the engine). */
export function moduleTempC(site: string, at: Date, irradianceWm2: number, noctC: number): number {
  return cellTemperature({ ambientC: ambientC(site, at), irradianceWm2, noctC });
}
