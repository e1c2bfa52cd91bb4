/* Reference vectors for shared/grid/prng.ts.
 *
 * next() is xoshiro128** 1.1 and splitmix_next() is SplitMix64, both as
 * published by David Blackman and Sebastiano Vigna at
 * https://prng.di.unimi.it/ (public domain), unchanged but for names.
 * Seeding follows prng.ts: two SplitMix64 outputs, low word first.
 *
 *   gcc -O2 -o /tmp/prng-vectors tests/unit/grid/prng-vectors.c && /tmp/prng-vectors
 */
#include <stdint.h>
#include <stdio.h>

static inline uint32_t rotl(const uint32_t x, int k) {
	return (x << k) | (x >> (32 - k));
}

static uint32_t s[4];

static uint32_t next(void) {
	const uint32_t result = rotl(s[1] * 5, 7) * 9;
	const uint32_t t = s[1] << 9;
	s[2] ^= s[0];
	s[3] ^= s[1];
	s[1] ^= s[2];
	s[0] ^= s[3];
	s[2] ^= t;
	s[3] = rotl(s[3], 11);
	return result;
}

static uint64_t x;

static uint64_t splitmix_next(void) {
	uint64_t z = (x += 0x9e3779b97f4a7c15);
	z = (z ^ (z >> 30)) * 0xbf58476d1ce4e5b9;
	z = (z ^ (z >> 27)) * 0x94d049bb133111eb;
	return z ^ (z >> 31);
}

static void seed(uint64_t v) {
	x = v;
	uint64_t a = splitmix_next(), b = splitmix_next();
	s[0] = (uint32_t)a; s[1] = (uint32_t)(a >> 32);
	s[2] = (uint32_t)b; s[3] = (uint32_t)(b >> 32);
}

/* Uniform integer in [0, n) for n <= 2^32 as in prng.ts below(): take the
 * top bitlen(n - 1) bits of one output, reject values >= n. */
static uint32_t below(uint32_t n) {
	if (n == 1) return 0;
	int bits = 0;
	for (uint32_t v = n - 1; v; v >>= 1) bits++;
	for (;;) {
		uint32_t v = next() >> (32 - bits);
		if (v < n) return v;
	}
}

int main(void) {
	s[0] = 1; s[1] = 2; s[2] = 3; s[3] = 4;
	printf("state 1,2,3,4:");
	for (int i = 0; i < 6; i++) printf(" %u", next());
	printf("\n");
	x = 0;
	printf("splitmix64 seed 0:");
	for (int i = 0; i < 3; i++) printf(" %llu", (unsigned long long)splitmix_next());
	printf("\n");
	const uint64_t seeds[] = { 0, 42, 20261201, 9007199254740991ULL };
	for (int k = 0; k < 4; k++) {
		seed(seeds[k]);
		printf("seed %llu:", (unsigned long long)seeds[k]);
		for (int i = 0; i < 6; i++) printf(" %u", next());
		printf("\n");
	}
	/* The random part of tests/unit/grid/expand.test.ts: seed 7, n in 0..50,
	 * x in [-1, 1] with 3 places (lattice of 2001 points), 5 draws. */
	seed(7);
	printf("seed 7 points:");
	for (int i = 0; i < 5; i++) {
		uint32_t n = below(51);
		int32_t k = (int32_t)below(2001) - 1000;
		printf(" n=%u,x=%s%d.%03d", n, k < 0 ? "-" : "", (k < 0 ? -k : k) / 1000, (k < 0 ? -k : k) % 1000);
	}
	printf("\n");
	return 0;
}
