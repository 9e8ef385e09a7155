import bcrypt from 'bcryptjs'
import { eq, sql } from 'drizzle-orm'
import passport from 'passport'
import { Strategy as LocalStrategy } from 'passport-local'
import { users } from '../../../schema/index'
import type { Db } from '../db/client'

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface User {
      id: number
      email: string
      name: string
      isAdmin: boolean
    }
  }
}

declare module 'express-session' {
  interface SessionData {
    csrfToken?: string
  }
}

/** bcrypt cost: 10 rounds (about 70 ms here), the common default. */
export const BCRYPT_ROUNDS = 10
export const hashPassword = (password: string) => bcrypt.hash(password, BCRYPT_ROUNDS)

// Compared against when the e-mail is unknown, so both paths take the same time.
const DUMMY_HASH = bcrypt.hashSync('not-a-real-password', BCRYPT_ROUNDS)

const publicUser = (u: typeof users.$inferSelect): Express.User => ({
  id: u.id,
  email: u.email,
  name: u.name,
  isAdmin: u.isAdmin,
})

/** A passport instance of our own (not the global singleton), so several apps can coexist in tests. */
export function createPassport(db: Db): passport.PassportStatic {
  const instance = new passport.Passport() as unknown as passport.PassportStatic
  instance.use(
    new LocalStrategy({ usernameField: 'email' }, async (email, password, done) => {
      try {
        const [user] = await db
          .select()
          .from(users)
          .where(eq(sql`lower(${users.email})`, email.toLowerCase()))
        const ok = await bcrypt.compare(password, user?.passwordHash ?? DUMMY_HASH)
        if (!user || !ok || user.disabled) return done(null, false)
        return done(null, publicUser(user))
      } catch (err: unknown) {
        return done(err)
      }
    }),
  )
  instance.serializeUser((user, done) => done(null, user.id))
  instance.deserializeUser(async (id: number, done) => {
    try {
      const [user] = await db.select().from(users).where(eq(users.id, id))
      // A disabled or deleted user loses the session at the next request.
      done(null, user && !user.disabled ? publicUser(user) : false)
    } catch (err: unknown) {
      done(err)
    }
  })
  return instance
}
