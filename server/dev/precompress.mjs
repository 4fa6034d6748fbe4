// Brotli and gzip copies of the web export's text files (`x.js.br`, `x.js.gz`), written once after
// `expo export` at the highest levels, so the server sends them as they are instead of compressing each
// response on the fly at a low level. Plain Node: it runs inside the bootstrap.
import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';

const COMPRESSIBLE = new Set(['.js', '.html', '.css', '.json', '.ttf', '.otf', '.svg', '.txt', '.webmanifest']);
const MIN_BYTES = 1024;

export function precompressExport(dir) {
  let files = 0;
  const walk = (sub) => {
    for (const entry of fs.readdirSync(sub, { withFileTypes: true })) {
      const full = path.join(sub, entry.name);
      if (entry.isDirectory()) walk(full);
      else if (COMPRESSIBLE.has(path.extname(entry.name)) && fs.statSync(full).size >= MIN_BYTES) {
        const raw = fs.readFileSync(full);
        fs.writeFileSync(
          `${full}.br`,
          zlib.brotliCompressSync(raw, {
            params: {
              [zlib.constants.BROTLI_PARAM_QUALITY]: zlib.constants.BROTLI_MAX_QUALITY,
              [zlib.constants.BROTLI_PARAM_SIZE_HINT]: raw.length,
            },
          }),
        );
        fs.writeFileSync(`${full}.gz`, zlib.gzipSync(raw, { level: 9 }));
        files++;
      }
    }
  };
  walk(dir);
  return files;
}
