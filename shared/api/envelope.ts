/** A successful answer: `{ data }`; lists add `page`. */
export interface DataEnvelope<T> {
  data: T
}

export interface Page {
  number: number
  size: number
  total: number
}

export interface PageEnvelope<T> {
  data: T[]
  page: Page
}
