/*
 * Shapes every API area shares: a person as a list shows them, and the `{ item }` / `{ items }`
 * envelopes of single and unpaged answers.
 */

export interface UserRef {
  id: string;
  name: string;
}

export interface ItemsResponse<T> {
  items: T[];
}

export interface ItemResponse<T> {
  item: T;
}
