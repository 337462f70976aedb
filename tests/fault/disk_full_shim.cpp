// A full disk for one process, without touching a real device: preloaded (LD_PRELOAD) into
// gramline-cli by the fault tests, it lets the first GRAMLINE_TEST_DISK_BYTES bytes written to
// regular files through, then fails every further write to a regular file with ENOSPC, as a
// filesystem with that much free space would. Pipes and terminals (standard output, standard
// error) are never affected.
#include <dlfcn.h>
#include <sys/stat.h>
#include <sys/types.h>
#include <sys/uio.h>
#include <unistd.h>

#include <atomic>
#include <cerrno>
#include <cstdlib>

namespace {

using WriteFn = ssize_t (*)(int, const void*, size_t);
using WritevFn = ssize_t (*)(int, const struct iovec*, int);
using PwriteFn = ssize_t (*)(int, const void*, size_t, off_t);

std::atomic<long long> g_free_bytes{-1};  // -1: not read from the environment yet

long long& free_bytes_init() {
  static long long initial = [] {
    const char* text = std::getenv("GRAMLINE_TEST_DISK_BYTES");
    return text ? std::atoll(text) : (1LL << 62);
  }();
  return initial;
}

bool is_regular_file(int fd) {
  struct stat st {};
  return fstat(fd, &st) == 0 && S_ISREG(st.st_mode);
}

/// How many of `wanted` bytes the "disk" still takes (0 when full).
size_t take(size_t wanted) {
  long long expected = g_free_bytes.load();
  if (expected < 0) {
    g_free_bytes.compare_exchange_strong(expected, free_bytes_init());
    expected = g_free_bytes.load();
  }
  while (true) {
    const long long granted =
        static_cast<long long>(wanted) < expected ? static_cast<long long>(wanted) : expected;
    if (g_free_bytes.compare_exchange_weak(expected, expected - granted))
      return static_cast<size_t>(granted);
  }
}

template <class Fn>
Fn next(const char* name) {
  return reinterpret_cast<Fn>(dlsym(RTLD_NEXT, name));
}

}  // namespace

extern "C" ssize_t write(int fd, const void* buffer, size_t count) {
  static const WriteFn real = next<WriteFn>("write");
  if (count == 0 || fd <= 2 || !is_regular_file(fd)) return real(fd, buffer, count);
  const size_t granted = take(count);
  if (granted == 0) {
    errno = ENOSPC;
    return -1;
  }
  return real(fd, buffer, granted);
}

extern "C" ssize_t pwrite(int fd, const void* buffer, size_t count, off_t offset) {
  static const PwriteFn real = next<PwriteFn>("pwrite");
  if (count == 0 || fd <= 2 || !is_regular_file(fd)) return real(fd, buffer, count, offset);
  const size_t granted = take(count);
  if (granted == 0) {
    errno = ENOSPC;
    return -1;
  }
  return real(fd, buffer, granted, offset);
}

extern "C" ssize_t writev(int fd, const struct iovec* parts, int count) {
  static const WritevFn real = next<WritevFn>("writev");
  if (fd <= 2 || !is_regular_file(fd)) return real(fd, parts, count);
  // Only the first part, as much of it as fits: a short write the caller must continue.
  for (int i = 0; i < count; ++i) {
    if (parts[i].iov_len == 0) continue;
    return write(fd, parts[i].iov_base, parts[i].iov_len);
  }
  return 0;
}
