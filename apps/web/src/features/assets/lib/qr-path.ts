import QRCode from 'qrcode';

export type QrPath = { /** Modules per side, without the quiet zone. */ size: number; /** SVG path of the dark modules, one unit per module. */ path: string };

/**
 * A QR code (error correction M: survives a scuffed label) as one SVG path, row runs merged, so a
 * sheet of 600 labels stays light and prints crisp at any size.
 */
export function qrPath(text: string): QrPath {
  const { modules } = QRCode.create(text, { errorCorrectionLevel: 'M' });
  const { size, data } = modules;
  let path = '';
  for (let y = 0; y < size; y += 1) {
    let x = 0;
    while (x < size) {
      if (!data[y * size + x]) {
        x += 1;
        continue;
      }
      const start = x;
      while (x < size && data[y * size + x]) x += 1;
      path += `M${start} ${y}h${x - start}v1h-${x - start}z`;
    }
  }
  return { size, path };
}

/** The absolute address a label's QR code opens: this app's origin plus the in-app path. */
export function labelUrl(origin: string, path: string): string {
  return `${origin.replace(/\/+$/, '')}${path}`;
}
