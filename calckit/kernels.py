"""Kernel managers for the batch: ipc sockets (no TCP port races) and, optionally, forked kernels.

Every calc runs in a kernel process of its own that has never run other code. Starting a Python kernel
and importing the libraries a calc needs (numpy, pint, sympy, IPython, calckit) costs about 2 s of CPU
per calc, more than most calcs themselves; with ``fork=True`` the batch starts one *template* process
that imports those libraries once (and nothing else: no calc, no user code, no zmq context, single
BLAS thread) and each kernel is a fresh ``fork()`` of it. The kernel command that jupyter_client
launches is a small relay process (``python -m calckit.kernels launch``) that asks the template for a
child, hands it its standard streams, forwards signals to it and exits with its exit code; the child
exits by itself if the relay disappears (watchdog) or the template dies (ipykernel's parent poller).

``CALCKIT_FORK_KERNELS=0`` (or ``calckit run --no-fork``) turns forking off: plain ``python -m
ipykernel_launcher`` kernels over ipc. Either way the notebook sees a kernel that is new to it; the
numbers are the same (``calckit verify`` re-executes with a plain kernel).

POSIX only (fork, Unix sockets); elsewhere the batch uses plain kernels.
"""
from __future__ import annotations

import atexit
import json
import os
import socket
import struct
import subprocess
import sys
import tempfile
import threading
import time

__all__ = ["ipc_manager", "Template", "template", "fork_enabled", "PRELOAD"]

#: modules the template imports before forking (library code only)
PRELOAD = (
    "numpy", "yaml", "ipykernel.kernelapp", "ipykernel.ipkernel", "ipykernel.debugger", "IPython.display",
    "IPython.core.completerlib", "IPython.core.debugger", "IPython.core.oinspect",
    "IPython.extensions.storemagic", "sqlite3", "psutil", "tornado.platform.asyncio", "faulthandler", "sympy",
    "sympy.parsing.sympy_parser", "sympy.printing.latex", "sympy.utilities.lambdify", "pint",
    "calckit.units", "calckit.materials", "calckit.sections", "calckit.sections.catalog", "calckit.analysis",
    "calckit.analysis.combinations", "calckit.render", "calckit.render.blocks", "calckit.render.payload",
    "calckit.render.html", "calckit.render.latex", "calckit.design.stress", "calckit.design.shear_flow",
    "calckit.design.aisc360", "calckit.design.en1993", "calckit.params", "calckit.sheets",
    "calckit.sheets.beam", "calckit.sheets.girder", "calckit.sheets.builtup", "calckit.sheets.svgplot",
)


def fork_enabled() -> bool:
    return (os.name == "posix" and hasattr(os, "fork") and hasattr(socket, "send_fds")
            and os.environ.get("CALCKIT_FORK_KERNELS", "1") not in ("0", "false", "no"))


# ---------------------------------------------------------------------------------------------------
# kernel managers
# ---------------------------------------------------------------------------------------------------
def ipc_manager(folder: str, handles: list, launcher: list[str] | None = None):
    """An AsyncKernelManager class whose kernels use ipc sockets under ``folder`` (no TCP ports); kernel
    stderr goes to ``folder/kernel.log`` (the open file is appended to ``handles`` for the caller to
    close). With ``launcher`` (argv prefix), the kernel command is ``launcher + ['-f', <connection
    file>]`` instead of the kernelspec's."""
    from jupyter_client.manager import AsyncKernelManager
    from traitlets import default

    ip = os.path.join(folder, "k")

    class IPCKernelManager(AsyncKernelManager):
        async def start_kernel(self, **kw):
            if "stderr" not in kw:
                kw["stderr"] = open(os.path.join(folder, "kernel.log"), "ab")
                handles.append(kw["stderr"])
            return await self._async_start_kernel(**kw)

        def format_kernel_cmd(self, extra_arguments=None):
            if launcher is None:
                return super().format_kernel_cmd(extra_arguments)
            return list(launcher) + ["-f", self.connection_file]

        @default("transport")
        def _transport_default(self):
            return "ipc"

        @default("ip")
        def _ip_default(self):
            return ip

    return IPCKernelManager


# ---------------------------------------------------------------------------------------------------
# the template process (server side)
# ---------------------------------------------------------------------------------------------------
def _send(conn, obj) -> None:
    data = json.dumps(obj).encode()
    conn.sendall(struct.pack("!I", len(data)) + data)


def _recv(conn):
    head = b""
    while len(head) < 4:
        chunk = conn.recv(4 - len(head))
        if not chunk:
            return None
        head += chunk
    (n,) = struct.unpack("!I", head)
    data = b""
    while len(data) < n:
        chunk = conn.recv(n - len(data))
        if not chunk:
            return None
        data += chunk
    return json.loads(data)


def _child(conn, fds, req) -> None:
    """In the forked child: become the kernel described by ``req``; never returns."""
    code = 1
    try:
        for i, fd in enumerate(fds[:3]):
            os.dup2(fd, i)
        for fd in fds:
            if fd > 2:
                os.close(fd)
        os.environ.clear()
        os.environ.update(req["env"])
        os.chdir(req["cwd"])

        def watchdog():  # the relay is the process jupyter_client watches: die with it
            import select

            while True:  # the relay's end of the connection closes when it exits, even as a zombie
                r, _, _ = select.select([conn], [], [], 1.0)
                if r:
                    try:
                        if not conn.recv(1):
                            os._exit(1)
                    except OSError:
                        os._exit(1)

        threading.Thread(target=watchdog, daemon=True).start()
        _send(conn, {"pid": os.getpid()})
        # parent_handle as ipykernel_launcher gets it from JPY_PARENT_PID (read at import, in the
        # template): the kernel then polls for its parent exiting and stays quiet on the terminal
        argv = list(req["argv"]) + [f"--IPKernelApp.parent_handle={os.getppid()}"]
        import importlib.util

        spec = importlib.util.find_spec("ipykernel_launcher")
        sys.argv = [spec.origin if spec and spec.origin else "ipykernel_launcher"] + argv
        from ipykernel.kernelapp import IPKernelApp

        IPKernelApp.launch_instance(argv=argv)
        code = 0
    except SystemExit as exc:
        code = exc.code if isinstance(exc.code, int) else 0
    except BaseException:  # pragma: no cover - reported on the kernel's stderr
        import traceback

        traceback.print_exc()
    finally:
        try:
            sys.stdout.flush()
            sys.stderr.flush()
        except Exception:
            pass
        os._exit(code)


def serve(path: str) -> None:
    """Run the template: preload, listen on the Unix socket ``path``, fork one kernel per request."""
    import importlib
    import select

    for mod in PRELOAD:
        try:
            importlib.import_module(mod)
        except Exception:  # a missing optional module only costs speed
            pass
    try:
        from calckit.units import to_si

        to_si("1 m", "length")  # builds the unit registry (definitions only)
    except Exception:
        pass
    warm = _formulas_to_warm()
    srv = socket.socket(socket.AF_UNIX, socket.SOCK_STREAM)
    srv.bind(path + ".tmp")
    os.rename(path + ".tmp", path)  # clients see the socket only once it listens
    srv.listen(64)
    children: dict[int, socket.socket] = {}
    parent = os.getppid()
    import signal

    wake_r, wake_w = os.pipe()  # SIGCHLD wakes the loop at once (a child's exit is reported promptly)
    os.set_blocking(wake_r, False)
    os.set_blocking(wake_w, False)
    signal.signal(signal.SIGCHLD, lambda *_: None)
    signal.set_wakeup_fd(wake_w)
    while True:
        try:
            r, _, _ = select.select([srv, wake_r], [], [], 0.0 if warm else 0.5)
        except InterruptedError:
            r = [wake_r]
        if wake_r in r:
            try:
                while os.read(wake_r, 512):
                    pass
            except BlockingIOError:
                pass
        if not r and warm:  # idle: compile formulas ahead (children forked later inherit them)
            t_end = time.perf_counter() + 0.02
            while warm and time.perf_counter() < t_end:
                _warm_one(warm.pop())
            continue
        if srv in r:
            conn, _ = srv.accept()
            try:
                msg, fds, _, _ = socket.recv_fds(conn, 1 << 16, 8)
                req = json.loads(msg.decode())
            except Exception:
                conn.close()
                continue
            pid = os.fork()
            if pid == 0:
                signal.set_wakeup_fd(-1)
                signal.signal(signal.SIGCHLD, signal.SIG_DFL)
                os.close(wake_r)
                os.close(wake_w)
                srv.close()
                for c in children.values():
                    c.close()
                _child(conn, fds, req)
            for fd in fds:
                os.close(fd)
            children[pid] = conn
        while children:
            try:
                pid, status = os.waitpid(-1, os.WNOHANG)
            except ChildProcessError:
                break
            if pid == 0:
                break
            conn = children.pop(pid, None)
            if conn is not None:
                try:
                    _send(conn, {"exit": os.waitstatus_to_exitcode(status)})
                except OSError:
                    pass
                conn.close()
        if os.getppid() != parent:  # the batch is gone
            for pid in list(children):
                try:
                    os.kill(pid, 15)
                except OSError:
                    pass
            return


def _formulas_to_warm() -> list:
    """Formula objects defined at module level by the preloaded modules (calckit.render.Formula)."""
    try:
        import gc

        from calckit.render.formula import Condition, Formula
    except Exception:
        return []
    found = [o for o in gc.get_objects() if isinstance(o, (Formula, Condition))]
    return found[::-1]


def _warm_one(obj) -> None:
    """Parse and lambdify one formula now (the same cache its first evaluation would fill)."""
    try:
        if hasattr(obj, "_side_formulas"):
            for f in obj._side_formulas():
                f._compiled()
        else:
            obj._compiled()
    except Exception:  # warming is only for speed; a formula that fails here fails in the calc too
        pass


def launch(path: str, argv: list[str]) -> int:
    """The relay (the kernel command): get a forked kernel from the template at ``path``; forward
    signals to it; exit with its exit code."""
    import signal

    deadline = time.time() + 120
    while True:
        try:
            conn = socket.socket(socket.AF_UNIX, socket.SOCK_STREAM)
            conn.connect(path)
            break
        except OSError:
            conn.close()
            if time.time() > deadline:
                print(f"calckit.kernels: no kernel template at {path}", file=sys.stderr)
                return 1
            time.sleep(0.02)
    req = {"argv": argv, "env": dict(os.environ), "cwd": os.getcwd(), "pid": os.getpid()}
    socket.send_fds(conn, [json.dumps(req).encode()], [0, 1, 2])
    msg = _recv(conn)
    if not msg or "pid" not in msg:
        return 1
    child = int(msg["pid"])

    def forward(signum, _frame):
        try:
            os.kill(child, signum)
        except OSError:
            pass

    for s in (signal.SIGINT, signal.SIGTERM, signal.SIGHUP, signal.SIGQUIT):
        signal.signal(s, forward)
    while True:
        try:
            msg = _recv(conn)
        except InterruptedError:
            continue
        if msg is None:
            forward(signal.SIGKILL, None)
            return 1
        if "exit" in msg:
            return int(msg["exit"])


# ---------------------------------------------------------------------------------------------------
# the batch's handle on the template
# ---------------------------------------------------------------------------------------------------
class Template:
    """The template process of one batch (started on first use, stopped at exit)."""

    def __init__(self):
        self.dir = tempfile.mkdtemp(prefix="ck-tpl-")
        self.path = os.path.join(self.dir, "s")
        env = dict(os.environ, OPENBLAS_NUM_THREADS="1", OMP_NUM_THREADS="1", MKL_NUM_THREADS="1",
                   PYDEVD_DISABLE_FILE_VALIDATION="1")
        self.proc = subprocess.Popen([sys.executable, "-m", "calckit.kernels", "serve", self.path], env=env,
                                     stdin=subprocess.DEVNULL, stdout=subprocess.DEVNULL,
                                     stderr=open(os.path.join(self.dir, "template.log"), "ab"))
        atexit.register(self.stop)

    @property
    def launcher(self) -> list[str]:
        return [sys.executable, "-m", "calckit.kernels", "launch", self.path]

    def alive(self) -> bool:
        return self.proc.poll() is None

    def ready(self, timeout: float = 90.0) -> bool:
        """Wait until the template listens (True) or has exited / timed out (False)."""
        deadline = time.time() + timeout
        while time.time() < deadline:
            if os.path.exists(self.path):
                return True
            if self.proc.poll() is not None:
                return False
            time.sleep(0.02)
        return False

    def stop(self) -> None:
        if self.proc.poll() is None:
            self.proc.terminate()
            try:
                self.proc.wait(5)
            except subprocess.TimeoutExpired:
                self.proc.kill()
        import shutil

        shutil.rmtree(self.dir, ignore_errors=True)


_template: Template | None = None
_failed = False
_lock = threading.Lock()


def template(wait: bool = False) -> Template | None:
    """The running template (started now if needed), or None when forking is off or unavailable.

    With ``wait``, block until it listens; a template that fails to start turns forking off for the rest
    of the process (plain kernels are used, with a note on stderr)."""
    global _template, _failed
    if not fork_enabled() or _failed:
        return None
    with _lock:
        if _template is None or not _template.alive():
            try:
                _template = Template()
            except OSError:
                _template = None
        t = _template
        if t is not None and wait and not t.ready():
            log = os.path.join(t.dir, "template.log")
            tail = open(log, errors="replace").read()[-400:] if os.path.exists(log) else ""
            print(f"calckit: the kernel template did not start; using plain kernels\n{tail}", file=sys.stderr)
            _failed = True
            t.stop()
            _template = t = None
        return t


def main(argv=None) -> int:
    argv = list(sys.argv[1:] if argv is None else argv)
    if argv[:1] == ["serve"] and len(argv) == 2:
        serve(argv[1])
        return 0
    if argv[:1] == ["launch"] and len(argv) >= 2:
        return launch(argv[1], argv[2:])
    print("usage: python -m calckit.kernels serve PATH | launch PATH -f CONNECTION_FILE", file=sys.stderr)
    return 2


if __name__ == "__main__":
    sys.exit(main())
