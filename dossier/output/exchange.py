"""Swapping two folders in one step, where the system can: Linux's renameat2 with RENAME_EXCHANGE.

With it, the output path always names a whole site, the old one or the new one, even if the process is
killed mid-swap. Where the call or the file system does not support it, exchange() says so and the
caller falls back to two renames (see atomic.swap_in).
"""

from __future__ import annotations

import ctypes
import errno
import os
from pathlib import Path

AT_FDCWD = -100
RENAME_EXCHANGE = 2
UNSUPPORTED = {errno.EINVAL, errno.ENOSYS, errno.EOPNOTSUPP, errno.EPERM}


def _renameat2():
    try:
        return ctypes.CDLL(None, use_errno=True).renameat2
    except (OSError, AttributeError):  # not Linux, or a C library without the call
        return None


_CALL = _renameat2()


def exchange(first: Path, second: Path) -> bool:
    """Swap two existing paths atomically; False (nothing done) where the system cannot."""
    if _CALL is None:
        return False
    if _CALL(AT_FDCWD, os.fsencode(first), AT_FDCWD, os.fsencode(second), RENAME_EXCHANGE) == 0:
        return True
    code = ctypes.get_errno()
    if code in UNSUPPORTED:
        return False
    raise OSError(code, os.strerror(code), str(first), None, str(second))
