import { describe, expect, it } from 'vitest'
import { keyPerContent } from '../../shared/api/idempotency'

describe('the key a form sends with a create', () => {
  it('stays the same while the same thing is sent again, and changes with the content', () => {
    const keyFor = keyPerContent()
    const first = keyFor({ title: 'Cracked weld', organisationId: 1 })
    expect(first).toMatch(/^[0-9a-f]{32}$/)
    expect(keyFor({ title: 'Cracked weld', organisationId: 1 })).toBe(first)
    const changed = keyFor({ title: 'Cracked weld seam', organisationId: 1 })
    expect(changed).not.toBe(first)
    expect(keyFor({ title: 'Cracked weld seam', organisationId: 1 })).toBe(changed)
  })

  it('differs between two forms that send the same thing', () => {
    const value = { title: 'Same failure' }
    expect(keyPerContent()(value)).not.toBe(keyPerContent()(value))
  })
})
