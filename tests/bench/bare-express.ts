import express from 'express';

/** One bare Express route, the yardstick of the load run. Tells its parent the port it got. */
const app = express();
app.disable('x-powered-by');
app.get('/hello', (_req, res) => void res.json({ hello: 'world' }));
const server = app.listen(0, '127.0.0.1', () => {
  const address = server.address();
  process.send?.({ port: typeof address === 'object' && address ? address.port : 0 });
});
process.on('SIGTERM', () => server.close(() => process.exit(0)));
