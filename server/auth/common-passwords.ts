import { dictionary } from '@zxcvbn-ts/language-common'

// The most common passwords seen in published breaches, as shipped by @zxcvbn-ts/language-common
// (MIT); compared without regard to letter case.
let known: Set<string> | undefined

export function isCommonPassword(password: string): boolean {
  known ??= new Set(dictionary['passwords-common'].map((entry) => entry.toLowerCase()))
  return known.has(password.normalize('NFKC').toLowerCase())
}
