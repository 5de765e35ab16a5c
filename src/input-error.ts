// The one error type for input that cannot be used: a drawing, a config or an option.
// The CLI prints its message on one line and exits 2; every stage throws only this for bad input.

export class InputError extends Error {
  override readonly name = 'InputError';
}

export const fail = (message: string): never => {
  throw new InputError(message);
};
