//go:build !(linux || darwin || freebsd || netbsd || openbsd || dragonfly)

package journal

import "os"

// haveFlock: no kernel lock here; the O_EXCL lock file alone guards the
// record and is never taken over.
const haveFlock = false

func flock(*os.File) error { return nil }

func funlock(*os.File) {}

func flockFd(uintptr) error { return nil }
