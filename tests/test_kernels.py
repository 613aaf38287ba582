"""Forked kernels (calckit.kernels): a clean namespace, the same results as a plain kernel, no orphans."""
from __future__ import annotations

import asyncio
import os
import signal
import time

import pytest

from calckit import kernels

pytestmark = pytest.mark.skipif(not kernels.fork_enabled(), reason="forked kernels need POSIX fork")


def test_switch_off_with_the_environment(monkeypatch):
    monkeypatch.setenv("CALCKIT_FORK_KERNELS", "0")
    assert kernels.fork_enabled() is False and kernels.template() is None


async def _run(code: str, launcher, folder, then=None):
    """Start a kernel, run ``code``, return its printed text; ``then(text, km)`` runs before shutdown."""
    KM = kernels.ipc_manager(folder, [], launcher)
    km = KM(kernel_name="python3")
    await km.start_kernel()
    kc = km.client()
    kc.start_channels()
    try:
        await kc.wait_for_ready(timeout=60)
        kc.execute(code)
        text = ""
        while True:
            msg = await kc.get_iopub_msg(timeout=30)
            if msg["msg_type"] == "stream":
                text += msg["content"]["text"]
            if msg["msg_type"] == "status" and msg["content"]["execution_state"] == "idle" and text:
                break
        if then is not None:
            then(text, km)
        return text
    finally:
        kc.stop_channels()
        await km.shutdown_kernel(now=True)


def test_forked_kernel_is_clean_and_answers_like_a_plain_one(tmp_path):
    t = kernels.template(wait=True)
    assert t is not None
    code = ("import sys, os\nprint(sorted(k for k in globals() if not k.startswith('_')))\n"
            "print(sum(i * i for i in range(10)), os.getcwd())")
    (tmp_path / "a").mkdir()
    (tmp_path / "b").mkdir()
    forked = asyncio.run(_run(code, t.launcher, str(tmp_path / "a")))
    plain = asyncio.run(_run(code, None, str(tmp_path / "b")))
    assert forked == plain
    assert "285" in forked


def test_child_exits_when_its_relay_is_killed(tmp_path):
    t = kernels.template(wait=True)
    seen = {}

    def kill_relay(text, km):
        child, relay = int(text.strip()), km.provisioner.process.pid
        assert child != relay
        os.kill(relay, signal.SIGKILL)  # behind jupyter_client's back: the relay stays a zombie
        deadline = time.time() + 10
        while time.time() < deadline:
            if not _running(child):
                seen["gone"] = True
                return
            time.sleep(0.1)

    asyncio.run(_run("import os\nprint(os.getpid())", t.launcher, str(tmp_path), then=kill_relay))
    assert seen.get("gone"), "the forked kernel outlived its relay"


def _running(pid: int) -> bool:
    """True while ``pid`` exists and is not a zombie."""
    try:
        with open(f"/proc/{pid}/stat") as fh:
            return fh.read().split(")")[-1].split()[0] != "Z"
    except OSError:
        return False
