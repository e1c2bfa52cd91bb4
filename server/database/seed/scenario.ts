// The invented demo scenario: the Corrie Point research campus, where four
// teams verify their Hermite-family codes. Every name here is made up.
import type { BuildEnvironment } from '../schema'
import type { Role } from '../../../shared/domain/enums'

export interface DemoUser { email: string, name: string, role: Role, password: string }

export const DEMO_USERS: DemoUser[] = [
  { email: 'admin@corrie-point.test', name: 'Ada Marrow', role: 'admin', password: 'demo-admin-2026' },
  { email: 'qa@corrie-point.test', name: 'Quentin Sorrel', role: 'qa', password: 'demo-qa-2026' },
  { email: 'owner@corrie-point.test', name: 'Olu Brennan', role: 'owner', password: 'demo-owner-2026' },
  { email: 'viewer@corrie-point.test', name: 'Vera Lindgrove', role: 'viewer', password: 'demo-viewer-2026' },
]

export const DEMO_TEAMS = [
  { slug: 'lowmoor-qc', name: 'Lowmoor Quantum Chemistry Group' },
  { slug: 'brackwater-risk', name: 'Brackwater Risk Analytics' },
  { slug: 'fenwick-optics', name: 'Fenwick Beam Optics Lab' },
]

const gcc: BuildEnvironment = { compiler: 'gfortran 13.2', flags: '-O2 -fno-fast-math', platform: 'x86_64-linux', floatFormat: 'binary64' }
const clang: BuildEnvironment = { compiler: 'clang 18', flags: '-O3 -ffp-contract=off', platform: 'x86_64-linux', floatFormat: 'binary64' }
const arm: BuildEnvironment = { compiler: 'gcc 14.1', flags: '-O2', platform: 'aarch64-linux', floatFormat: 'binary64' }

export const DEMO_CODES = [
  {
    slug: 'oscillite', name: 'Oscillite', team: 'lowmoor-qc', language: 'Fortran 2008',
    description: 'Harmonic-oscillator basis functions for vibrational structure calculations.',
    owners: ['owner@corrie-point.test'],
    versions: [
      { label: '2.3.0', commitId: '4e1a9c07d2b8', environment: gcc },
      { label: '2.4.0', commitId: '9b03f6e1aa45', environment: gcc },
      { label: '2.4.1', commitId: 'c7d2e80f1b36', environment: { ...gcc, compiler: 'gfortran 14.1' } },
    ],
  },
  {
    slug: 'quadrat', name: 'Quadrat', team: 'brackwater-risk', language: 'C++20',
    description: 'Gauss–Hermite quadrature rules for expectation pricing under Gaussian factors.',
    owners: ['owner@corrie-point.test'],
    versions: [
      { label: '1.0.0', commitId: '0f5c3b9e8d21', environment: clang },
      { label: '1.1.0', commitId: 'a8e47d6c0b93', environment: clang },
    ],
  },
  {
    slug: 'modeforge', name: 'Modeforge', team: 'fenwick-optics', language: 'C with Python bindings',
    description: 'Hermite–Gaussian beam modes for laser-cavity and fibre-coupling models.',
    owners: [] as string[],
    versions: [
      { label: '0.9.0', commitId: '3d6b1f0e7c52', environment: arm },
      { label: '0.9.1', commitId: 'e2a95c4d1f08', environment: arm },
      { label: '1.0.0-rc.1', commitId: '71fc0e3b9a64', environment: arm },
    ],
  },
]

/** Demo-only CI token for Oscillite. Never use a published token outside the demo. */
export const DEMO_TOKEN = {
  code: 'oscillite',
  name: 'Demo CI token (demo only)',
  scope: 'submit' as const,
  token: 'plb_demo_oscillite_7f3c2a9e51d84b06',
}
