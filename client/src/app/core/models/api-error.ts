/** Every error body the server sends: `{"error":{"code","message",...}}`. */
export interface ApiErrorBody {
  error: {
    code: string;
    message: string;
    [detail: string]: unknown;
  };
}
