/**
 * The shapes most answers are wrapped in, written once for the server that sends them and the
 * client that reads them. Each feature's DTOs (in the files beside this one) fill them in.
 */

/** A list answer: `{ items }`, in the order the server chose. */
export interface ItemsDto<T> {
  items: T[];
}

/** A list answer with the number of all matching rows (which may be more than `items` when paged). */
export interface ListDto<T> extends ItemsDto<T> {
  total: number;
}

/** An answer that only says what happened, in a sentence for the user. */
export interface MessageDto {
  message: string;
}
