/** The one error type routes and services throw; the error handler turns it into the API's error body `{ error: { code, message, fields? } }`. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
  ) {
    super(message);
    this.name = 'AppError';
  }

  static badRequest(message: string, fields?: Record<string, string>) {
    return new AppError(400, 'invalid_input', message, fields);
  }

  static notFound(what: string) {
    return new AppError(404, 'not_found', `${what} was not found.`);
  }

  static conflict(code: string, message: string, fields?: Record<string, string>) {
    return new AppError(409, code, message, fields);
  }
}
