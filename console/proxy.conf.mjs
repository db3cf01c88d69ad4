// Dev-server proxy: the console calls relative /api URLs, so the session cookie and the
// XSRF-TOKEN cookie stay first-party. CLINO_API_URL points at another server when needed.
const target = process.env.CLINO_API_URL ?? 'http://127.0.0.1:8640';

export default {
  '/api': {
    target,
    secure: false,
    changeOrigin: false,
    logLevel: 'warn',
  },
};
