// Development only (`ng serve`): forwards API and sign-in calls to the Express server.
const target = process.env.THALPOS_SERVER_URL ?? 'http://127.0.0.1:3000';

export default {
  '/api': { target, secure: false, changeOrigin: false },
  '/auth': { target, secure: false, changeOrigin: false },
};
