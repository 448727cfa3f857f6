/*
 * A stand-in for Windows' bcryptprimitives.dll, for running stave.exe under wine 8.0
 * (Debian 12), which lacks it. Go's Windows runtime loads ProcessPrng from it at start-up for
 * random numbers; Windows 10 and later have the real one. This one takes the same numbers from
 * RtlGenRandom, which wine has. Used only by .ci/dist-check.sh; never shipped.
 */
#include <windows.h>
#include <ntsecapi.h>

BOOL WINAPI ProcessPrng(PBYTE data, SIZE_T length)
{
	while (length > 0) {
		ULONG chunk = length > 0x40000000 ? 0x40000000 : (ULONG)length;
		if (!RtlGenRandom(data, chunk))
			return FALSE;
		data += chunk;
		length -= chunk;
	}
	return TRUE;
}
