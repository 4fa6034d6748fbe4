import sharp from 'sharp';

/** Joint positions of the generated figure, as fractions of the image (never a photo of a person). */
export const FIGURE = {
  'right-hip': [0.43, 0.48],
  'right-knee': [0.465, 0.66],
  'right-ankle': [0.41, 0.86],
  'left-hip': [0.57, 0.48],
  'left-knee': [0.55, 0.66],
  'left-ankle': [0.59, 0.86],
  'right-asis': [0.44, 0.45],
  'left-asis': [0.56, 0.455],
  'mid-shoulder': [0.5, 0.22],
  'mid-hip': [0.5, 0.48],
} as const;
export type Mark = keyof typeof FIGURE;

/** A 1800x2400 JPEG of a stick figure: big enough that the client has to scale it down. */
export async function figureJpeg(): Promise<Buffer> {
  const W = 1800;
  const H = 2400;
  const p = (m: Mark) => `${FIGURE[m][0] * W},${FIGURE[m][1] * H}`;
  const line = (a: Mark, b: Mark) => `<polyline points="${p(a)} ${p(b)}" stroke="#2b4a6f" stroke-width="60" stroke-linecap="round"/>`;
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}">
    <rect width="100%" height="100%" fill="#dfe6e9"/>
    <circle cx="${0.5 * W}" cy="${0.12 * H}" r="130" fill="#2b4a6f"/>
    <polyline points="${0.38 * W},${0.22 * H} ${0.62 * W},${0.22 * H}" stroke="#2b4a6f" stroke-width="60" stroke-linecap="round"/>
    ${line('mid-shoulder', 'mid-hip')}
    ${line('right-hip', 'left-hip')}
    ${line('right-hip', 'right-knee')}${line('right-knee', 'right-ankle')}
    ${line('left-hip', 'left-knee')}${line('left-knee', 'left-ankle')}
  </svg>`;
  return sharp(Buffer.from(svg)).jpeg({ quality: 80 }).toBuffer();
}
