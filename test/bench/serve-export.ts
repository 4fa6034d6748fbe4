// Serves a web export the way Squadline's server does (compression, then server/web's static serving),
// without the API. `npm run bench:web` runs the empty comparison app with it.
// Usage: tsx test/bench/serve-export.ts DIR PORT
import compression from 'compression';
import express from 'express';
import { webExport } from '../../server/web/serve-export';

const [dir, port] = process.argv.slice(2);
if (!dir || !port) throw new Error('Usage: tsx test/bench/serve-export.ts DIR PORT');
const web = webExport(dir);
if (!web) throw new Error(`No web export in ${dir}`);
const app = express();
app.disable('x-powered-by');
app.use(compression());
app.use(web.handler);
app.listen(Number(port), '127.0.0.1', () => process.stdout.write(`ready ${port}\n`));
