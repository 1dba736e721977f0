//go:build linux || darwin || freebsd || netbsd || openbsd || dragonfly

package journal

import (
	"os"
	"syscall"
)

// haveFlock: the kernel lock decides who holds a record.
const haveFlock = true

// flock takes an exclusive, non-blocking flock on f.
func flock(f *os.File) error {
	return syscall.Flock(int(f.Fd()), syscall.LOCK_EX|syscall.LOCK_NB)
}

func funlock(f *os.File) { syscall.Flock(int(f.Fd()), syscall.LOCK_UN) }

// flockFd takes an exclusive, non-blocking flock on an open descriptor.
func flockFd(fd uintptr) error {
	return syscall.Flock(int(fd), syscall.LOCK_EX|syscall.LOCK_NB)
}
