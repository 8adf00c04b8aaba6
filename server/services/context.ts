import type { Knex } from 'knex'
import type { Actor } from '../../shared/access/policy'

/**
 * What every service call works with: who acts, and the connection to act on. `db` may be a
 * transaction, so a change, its activity row and (later) its outbox mail commit together.
 */
export interface ServiceContext {
  actor: Actor
  db: Knex
}
