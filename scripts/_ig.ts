import { findUnsafeText } from '@/server/http/inputGuard';
const recs: unknown[] = []; for (let i = 0; i < 877638; i++) recs.push({ code: 'FEED-' + i, from: 'C' + i + '.TV', to: 'C' + (i + 1) + '.TV', medium: 'off-air', role: 'main', rxChannel: '34', notes: 'some notes here', lat: 51.1234 + i * 1e-6, lon: -1.2345 });
const body = { document: { feeds: recs } };
for (let k = 0; k < 3; k++) { const t = performance.now(); findUnsafeText(body, '', { rejectReservedKeys: true }); console.log('guard', (performance.now() - t).toFixed(0), 'ms'); }
