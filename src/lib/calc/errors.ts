/**
 * Thrown when inputs pass the schema but lie outside the validity of the method
 * (the API answers 422 `out_of_range` naming `input`).
 */
export class OutOfRangeError extends Error {
  constructor(
    public input: string,
    message: string,
  ) {
    super(message);
    this.name = 'OutOfRangeError';
  }
}
