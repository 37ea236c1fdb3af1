/**
 * A yardstick for the export scenario: a bare node:http server with no
 * Headwater code that answers every request with the bytes of one file, as
 * gzip, the way the export is sent. Measured with the same load generator
 * and settings, it shows how much of the export's figures is the generator's
 * own limit on this machine rather than the server's. Prints
 * "LISTENING <url>" when ready.
 *
 *   tsx scripts/load/bare-server.ts FILE
 */
import fs from 'node:fs';
import http from 'node:http';

const body = fs.readFileSync(process.argv[2]);
const server = http.createServer((_req, res) => {
  res.writeHead(200, { 'content-type': 'application/json', 'content-encoding': 'gzip', 'content-length': body.length });
  res.end(body);
});
server.listen(0, '127.0.0.1', () => {
  const address = server.address();
  if (address && typeof address === 'object') console.log(`LISTENING http://127.0.0.1:${address.port}`);
});
process.once('SIGTERM', () => server.close(() => process.exit(0)));
