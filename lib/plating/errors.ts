// Typed errors of the plating engine. Callers map them to field messages (PlatingInputError.field
// names the input that was wrong) or to a file-level message (StlError.code).

export class PlatingInputError extends Error {
  readonly field: string;

  constructor(field: string, message: string) {
    super(message);
    this.name = 'PlatingInputError';
    this.field = field;
  }
}

export type StlErrorCode =
  | 'empty' // no bytes, or a mesh with no triangles
  | 'truncated' // the data stops before the header's triangle count is reached
  | 'count-mismatch' // more data than the header's triangle count allows
  | 'non-finite' // a coordinate (or a computed total) is NaN or ±Infinity
  | 'bad-number' // ASCII: a token that should be a number is not one
  | 'unclosed-facet' // ASCII: the text ends inside a facet
  | 'syntax' // ASCII: a keyword is missing or out of place
  | 'not-stl' // neither a readable binary nor an ASCII STL
  | 'state'; // the parser was used after finish()

export class StlError extends Error {
  readonly code: StlErrorCode;

  constructor(code: StlErrorCode, message: string) {
    super(message);
    this.name = 'StlError';
    this.code = code;
  }
}
