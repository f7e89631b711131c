/**
 * Child process for the kill test: opens the store, says "ready", loads one file, says "done".
 * Usage: node --import tsx test/store/load-child.ts DB FILE NAME MODE
 */
import { loadCatalog, openStore } from '../../src/store/index.js';

const [db, file, name, mode] = process.argv.slice(2);
const store = openStore(db);
process.stdout.write('ready\n');
await loadCatalog(store, { source: file, name, mode: mode as 'create' | 'replace' });
store.close();
process.stdout.write('done\n');
