import { readonly, ref } from 'vue'

/** The class PrimeVue's preset keys its dark tokens on (see darkModeSelector in main.ts). */
export const DARK_CLASS = 'app-dark'
const STORAGE_KEY = 'downdip.colorScheme'

const dark = ref(false)

function readStored(): boolean {
  try {
    const stored = localStorage.getItem(STORAGE_KEY)
    if (stored) return stored === 'dark'
  } catch {
    // Storage blocked: follow the system.
  }
  return typeof matchMedia === 'function' && matchMedia('(prefers-color-scheme: dark)').matches
}

function apply(value: boolean) {
  dark.value = value
  document.documentElement.classList.toggle(DARK_CLASS, value)
}

/** Call once before mounting so the first paint is already in the remembered scheme. */
export function applyStoredColorScheme(): void {
  apply(readStored())
}

export function useColorScheme() {
  function toggle() {
    apply(!dark.value)
    try {
      localStorage.setItem(STORAGE_KEY, dark.value ? 'dark' : 'light')
    } catch {
      // Not remembered; the toggle still works for this visit.
    }
  }
  return { dark: readonly(dark), toggle }
}
