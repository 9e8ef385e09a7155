import { mkdir } from 'node:fs/promises'
import { fileURLToPath } from 'node:url'
import { chromium, type Browser } from 'playwright-core'

declare module 'vitest' {
  export interface ProvidedContext {
    /** Origin of the server that serves the built app and the API (from the e2e global setup). */
    baseUrl: string
  }
}

/** Debian's chromium, headless; never a downloaded browser. */
export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: '/usr/bin/chromium',
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  })
}

export const artifactsDir = fileURLToPath(new URL('../artifacts/', import.meta.url))

/** Path for a screenshot under tests/artifacts/ (git-ignored), creating the folder. */
export async function artifactPath(name: string): Promise<string> {
  await mkdir(artifactsDir, { recursive: true })
  return `${artifactsDir}${name}`
}
