// Dev-server proxy: the console calls relative /api URLs, so the session cookie and the
// XSRF-TOKEN cookie stay first-party. The server listens on CLINO_PORT (default 8640) on loopback;
// CLINO_API_URL points the proxy at a server elsewhere.
const target = process.env.CLINO_API_URL ?? `http://127.0.0.1:${process.env.CLINO_PORT ?? '8640'}`;

export default {
  '/api': {
    target,
    secure: false,
    changeOrigin: false,
    logLevel: 'warn',
  },
};
