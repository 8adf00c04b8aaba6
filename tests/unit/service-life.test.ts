import { describe, expect, it } from 'vitest'
import { serviceLife, type LifeEvent } from '../../shared/service-history/service-life'

const event = (
  kind: LifeEvent['kind'],
  occurredOn: string,
  hours: number | null = null,
  cycles: number | null = null,
): LifeEvent => ({ kind, occurredOn, hours, cycles })

describe('cumulative service life', () => {
  it('counts years from installation to the failure event, by the Julian year of 365.25 days', () => {
    // 2016-03-01 to 2026-03-01 spans 3653 days (two leap days); 3653 / 365.25 = 10.0 years
    const life = serviceLife(
      [
        event('manufacture', '2015-11-20'),
        event('installation', '2016-03-01', 0, 0),
        event('inspection', '2021-06-10', 21_400, 1_250_000),
        event('failure', '2026-03-01', 41_950, 2_480_000),
      ],
      { failureDate: null, today: '2026-12-01' },
    )
    expect(life).toEqual({
      from: '2016-03-01',
      to: '2026-03-01',
      ended: true,
      years: 10,
      hours: 41_950,
      cycles: 2_480_000,
    })
  })

  it('falls back to manufacture, to the case’s failure date, and to the last reading before it', () => {
    const life = serviceLife(
      [
        event('inspection', '2020-01-15', 8_000),
        event('manufacture', '2019-01-15'),
        event('inspection', '2025-01-15', 30_000),
      ],
      { failureDate: '2024-01-15', today: '2026-12-01' },
    )
    expect(life.from).toBe('2019-01-15')
    expect(life.to).toBe('2024-01-15')
    expect(life.years).toBe(5) // 1826 days / 365.25 = 4.999 → 5.0
    expect(life.hours).toBe(8_000) // the 2025 reading comes after the failure
    expect(life.cycles).toBeNull()
  })

  it('runs to today while no failure is recorded, and knows no start without one', () => {
    const life = serviceLife([event('repair', '2023-05-05', 100)], {
      failureDate: null,
      today: '2026-12-01',
    })
    expect(life).toMatchObject({ from: null, to: '2026-12-01', ended: false, years: null })
  })
})
