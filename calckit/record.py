"""Dated archive records of executed calcs: layout, normaliser, manifest, and re-verification.

Layout (``root`` is the output folder, ``outputs/`` by default)::

    root/manifest.jsonl                             append-only, one JSON object per line
    root/<YYYY-MM-DD>/<member>/<calc>-r<N>.ipynb    executed notebook (normalised)
    root/<YYYY-MM-DD>/<member>/<calc>-r<N>.html     standalone offline copy (calckit.render.export_html)
    root/<YYYY-MM-DD>/batch-<NN>-summary.csv|.html  summary table of one batch run

Nothing is ever overwritten. A revision number is reserved by creating a hidden ``.<calc>-r<N>.reserved``
file with exclusive-create mode (the next free number is taken when it exists: revisions count up per
member and calc across dates); a record file is written to a hidden temporary file and hard-linked to its
final name, which fails if the name exists, so a record file is either complete or absent. A manifest
line is appended (under an advisory lock, in one write, fsynced) only after its files are complete, so a
batch killed mid-run leaves every completed record and manifest line intact; a line cut short by a kill is
skipped when the manifest is read, and the next line starts on a fresh line.

Normaliser: executed notebooks differ between reruns only in volatile metadata (papermill's times and
paths, nbclient's ``metadata.execution``, the injected cell's random id, widget state); :func:`normalise`
removes or fixes those, so two runs of the same parameters with the same template and libraries give
byte-identical notebooks.

Verify (:func:`verify`): re-execute the archived notebook's parameters with its template in a fresh
kernel, compare every number of the results payload (relative tolerance 1e-9) and check the manifest
hashes of the archived files and of the template.
"""
from __future__ import annotations

import contextlib
import datetime as _dt
import hashlib
import json
import math
import os
import re
import sys
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any, Iterator

from .errors import InputError

__all__ = ["sha256_file", "sha256_bytes", "versions", "normalise", "notebook_bytes", "reserve_revision",
           "write_exclusive", "append_manifest", "read_manifest", "find_entry", "verify", "VerifyReport",
           "compare_payloads", "MANIFEST", "REL_TOL", "templates_dir", "template_path", "summary_payload"]

MANIFEST = "manifest.jsonl"
REL_TOL = 1e-9  #: relative tolerance of verify's number comparison
ABS_TOL = 0.0  #: absolute tolerance (none: a re-execution in the same environment is bit-identical)
INJECTED_ID = "injected-parameters"
_REV_RE = re.compile(r"^\.?(?P<calc>[a-z_]+)-r(?P<n>\d+)(?:\.ipynb|\.html|\.reserved)$")
KEY_LIBRARIES = ("numpy", "sympy", "pint", "matplotlib", "papermill", "nbconvert", "nbformat", "nbclient",
                 "ipykernel", "jupyter_client", "pyyaml", "latex2mathml", "ipywidgets")


# ---------------------------------------------------------------------------------------------------
# hashes and versions
# ---------------------------------------------------------------------------------------------------
def sha256_bytes(data: bytes) -> str:
    return hashlib.sha256(data).hexdigest()


def sha256_file(path) -> str:
    h = hashlib.sha256()
    with open(path, "rb") as fh:
        for chunk in iter(lambda: fh.read(1 << 20), b""):
            h.update(chunk)
    return h.hexdigest()


_versions_cache: dict[str, str] | None = None


def versions() -> dict[str, str]:
    """Versions of calckit, Python and the key libraries (read from package metadata, no imports)."""
    global _versions_cache
    if _versions_cache is None:
        from importlib.metadata import PackageNotFoundError, version

        from . import __version__

        out = {"calckit": __version__, "python": sys.version.split()[0]}
        for lib in KEY_LIBRARIES:
            try:
                out[lib] = version(lib)
            except PackageNotFoundError:
                out[lib] = "not installed"
        _versions_cache = out
    return dict(_versions_cache)


def templates_dir() -> Path:
    """Folder of the calc notebook templates: $CALCKIT_CALCS, else ``calcs/`` beside the package."""
    env = os.environ.get("CALCKIT_CALCS")
    if env:
        return Path(env)
    return Path(__file__).resolve().parent.parent / "calcs"


def template_path(calc: str) -> Path:
    p = templates_dir() / f"{calc}.ipynb"
    if not p.is_file():
        raise InputError(f"calc: got {calc!r}; its template {p} does not exist")
    return p


# ---------------------------------------------------------------------------------------------------
# normaliser
# ---------------------------------------------------------------------------------------------------
_WIDGET_MIME = "application/vnd.jupyter.widget-view+json"


def normalise(nb, *, template_name: str = "", output_name: str = ""):
    """Remove volatile metadata from an executed notebook in place (and return it).

    * notebook ``metadata.papermill``: start/end times and duration set to None, input/output paths
      replaced by ``template_name``/``output_name``, environment variables emptied;
    * each cell: ``metadata.execution`` (nbclient timestamps) removed, papermill times set to None;
    * cell ids made deterministic: the injected-parameters cell gets ``injected-parameters``, papermill
      error-marker cells ``papermill-error-<n>``; template cells keep their ids;
    * widget state (``metadata.widgets``) and widget-view outputs removed (widgets have random ids and
      render as nothing outside a live kernel).
    """
    md = nb.setdefault("metadata", {})
    pm = md.get("papermill")
    if isinstance(pm, dict):
        for k in ("start_time", "end_time", "duration"):
            if k in pm:
                pm[k] = None
        if "input_path" in pm:
            pm["input_path"] = template_name
        if "output_path" in pm:
            pm["output_path"] = output_name
        if "environment_variables" in pm:
            pm["environment_variables"] = {}
    md.pop("widgets", None)
    n_err = 0
    for cell in nb.get("cells", []):
        cmd = cell.setdefault("metadata", {})
        cmd.pop("execution", None)
        cpm = cmd.get("papermill")
        if isinstance(cpm, dict):
            for k in ("start_time", "end_time", "duration"):
                if k in cpm:
                    cpm[k] = None
        tags = cmd.get("tags", []) or []
        if "injected-parameters" in tags:
            cell["id"] = INJECTED_ID
        elif any(str(t).startswith("papermill-error-cell") for t in tags):
            n_err += 1
            cell["id"] = f"papermill-error-{n_err}"
        if cell.get("outputs"):
            cell["outputs"] = [o for o in cell["outputs"]
                               if not (o.get("data") and _WIDGET_MIME in o["data"])]
    return nb


def notebook_bytes(nb) -> bytes:
    """Serialised notebook (nbformat's writer: sorted keys, 1-space indent) ending in a newline."""
    import nbformat

    text = nbformat.writes(nb)
    if not text.endswith("\n"):
        text += "\n"
    return text.encode("utf-8")


# ---------------------------------------------------------------------------------------------------
# exclusive files and revisions
# ---------------------------------------------------------------------------------------------------
def write_exclusive(path, data: bytes) -> None:
    """Write ``data`` to ``path``, which must not exist (FileExistsError otherwise).

    The bytes go to a hidden temporary file created with exclusive-create mode, are fsynced, and the file
    is hard-linked to ``path`` (atomic, fails if ``path`` exists): ``path`` is complete or absent.
    """
    path = Path(path)
    tmp = path.with_name(f".{path.name}.{os.getpid()}.{os.urandom(4).hex()}.tmp")
    with open(tmp, "xb") as fh:
        fh.write(data)
        fh.flush()
        os.fsync(fh.fileno())
    try:
        try:
            os.link(tmp, path)
        except OSError as exc:
            if isinstance(exc, FileExistsError):
                raise
            # file systems without hard links: exclusive-create the final name directly
            with open(path, "xb") as fh:
                fh.write(data)
                fh.flush()
                os.fsync(fh.fileno())
    finally:
        with contextlib.suppress(FileNotFoundError):
            os.unlink(tmp)


def _existing_revisions(root: Path, member: str, calc: str) -> int:
    top = 0
    if not root.is_dir():
        return 0
    for day in root.iterdir():
        d = day / member
        if not d.is_dir():
            continue
        for f in d.iterdir():
            m = _REV_RE.match(f.name)
            if m and m.group("calc") == calc:
                top = max(top, int(m.group("n")))
    return top


def reserve_revision(root, date: str, member: str, calc: str) -> tuple[str, Path]:
    """Reserve the next revision of ``member``/``calc``; return (revision "r<N>", member folder).

    Revisions count up across all dates under ``root``. The reservation is a hidden file created with
    exclusive-create mode, so parallel runs never take the same number; :func:`release` removes it once
    the record files exist.
    """
    root = Path(root)
    folder = root / date / member
    folder.mkdir(parents=True, exist_ok=True)
    n = _existing_revisions(root, member, calc) + 1
    while True:
        try:
            with open(folder / f".{calc}-r{n}.reserved", "x"):
                pass
            if (folder / f"{calc}-r{n}.ipynb").exists():
                raise FileExistsError
            return f"r{n}", folder
        except FileExistsError:
            n += 1


def release(folder: Path, calc: str, revision: str) -> None:
    with contextlib.suppress(FileNotFoundError):
        os.unlink(Path(folder) / f".{calc}-{revision}.reserved")


# ---------------------------------------------------------------------------------------------------
# manifest
# ---------------------------------------------------------------------------------------------------
def append_manifest(root, entry: dict[str, Any]) -> None:
    """Append one JSON line to ``root/manifest.jsonl`` (locked, one write, fsynced)."""
    root = Path(root)
    root.mkdir(parents=True, exist_ok=True)
    line = json.dumps(entry, sort_keys=True, separators=(",", ":"), allow_nan=False) + "\n"
    fd = os.open(root / MANIFEST, os.O_RDWR | os.O_APPEND | os.O_CREAT, 0o644)
    try:
        with _locked(fd):
            size = os.fstat(fd).st_size
            if size and os.pread(fd, 1, size - 1) != b"\n":
                line = "\n" + line  # a previous writer was killed mid-line
            os.write(fd, line.encode("utf-8"))
            os.fsync(fd)
    finally:
        os.close(fd)


@contextlib.contextmanager
def _locked(fd: int):
    try:
        import fcntl
    except ImportError:  # pragma: no cover - not POSIX
        yield
        return
    fcntl.flock(fd, fcntl.LOCK_EX)
    try:
        yield
    finally:
        fcntl.flock(fd, fcntl.LOCK_UN)


def read_manifest(root, *, problems: list | None = None) -> list[dict[str, Any]]:
    """Every valid line of the manifest; a line that is not a JSON object is skipped (and, when
    ``problems`` is given, reported there as "manifest.jsonl:<line>: ...")."""
    path = Path(root) / MANIFEST
    if not path.is_file():
        return []
    out = []
    with open(path, encoding="utf-8", errors="replace") as fh:
        for i, line in enumerate(fh, 1):
            if not line.strip():
                continue
            try:
                obj = json.loads(line)
                if not isinstance(obj, dict):
                    raise ValueError("not an object")
            except ValueError as exc:
                if problems is not None:
                    problems.append(f"{MANIFEST}:{i}: skipped an unreadable line ({exc})")
                continue
            out.append(obj)
    return out


def find_entry(root, rel_path: str) -> dict[str, Any] | None:
    """The manifest line whose ipynb output is ``rel_path`` (relative to ``root``, '/'-separated)."""
    for e in reversed(read_manifest(root)):
        ipynb = (e.get("outputs") or {}).get("ipynb") or {}
        if ipynb.get("path") == rel_path:
            return e
    return None


def utc_now() -> str:
    return _dt.datetime.now(_dt.timezone.utc).isoformat(timespec="seconds").replace("+00:00", "Z")


# ---------------------------------------------------------------------------------------------------
# payload summary and comparison
# ---------------------------------------------------------------------------------------------------
def summary_payload(nb) -> dict[str, Any] | None:
    """The results payload of an executed notebook (calckit.render.read_results), or None."""
    from .render import payload as P

    found = P.read_all_results(nb)
    return found[-1] if found else None


def _flatten(x, path: str, out: dict[str, Any]) -> None:
    if isinstance(x, dict):
        if not x:
            out[path or "."] = {}
        for k in sorted(x):
            _flatten(x[k], f"{path}.{k}" if path else str(k), out)
    elif isinstance(x, list):
        if not x:
            out[path or "."] = []
        for i, v in enumerate(x):
            _flatten(v, f"{path}[{i}]", out)
    else:
        out[path or "."] = x


def _num(v) -> float | None:
    if isinstance(v, bool):
        return None
    if isinstance(v, (int, float)):
        return float(v)
    if v in ("inf", "-inf", "nan"):
        return float(v)
    return None


def compare_payloads(archived: dict, recomputed: dict, rel_tol: float = REL_TOL) -> list[str]:
    """Every difference between two payloads: numbers beyond ``rel_tol``, other values not equal,
    entries present in only one."""
    a: dict[str, Any] = {}
    b: dict[str, Any] = {}
    _flatten(archived, "", a)
    _flatten(recomputed, "", b)
    diffs = []
    for k in sorted(set(a) | set(b), key=_natural):
        if k not in b:
            diffs.append(f"{k}: in the record ({a[k]!r}) but not in the re-execution")
            continue
        if k not in a:
            diffs.append(f"{k}: in the re-execution ({b[k]!r}) but not in the record")
            continue
        x, y = a[k], b[k]
        nx, ny = _num(x), _num(y)
        if nx is not None and ny is not None:
            same = (math.isnan(nx) and math.isnan(ny)) or nx == ny or \
                math.isclose(nx, ny, rel_tol=rel_tol, abs_tol=ABS_TOL)
            if not same:
                rel = abs(nx - ny) / max(abs(nx), abs(ny)) if max(abs(nx), abs(ny)) else float("inf")
                diffs.append(f"{k}: record {x!r}, re-execution {y!r} (relative difference {rel:.3g})")
        elif x != y:
            diffs.append(f"{k}: record {x!r}, re-execution {y!r}")
    return diffs


def _natural(k: str):
    return [int(t) if t.isdigit() else t for t in re.split(r"(\d+)", k)]


# ---------------------------------------------------------------------------------------------------
# verify
# ---------------------------------------------------------------------------------------------------
@dataclass
class VerifyReport:
    """Outcome of :func:`verify`.

    same : True when every number agrees and every hash matches.
    differences : one line per difference (payload numbers, hashes, missing manifest line).
    notes : information that is not a difference (e.g. the parameter file changed since).
    error : set when the record could not be re-executed at all (then ``same`` is False).
    """

    path: str
    same: bool = False
    differences: list[str] = field(default_factory=list)
    notes: list[str] = field(default_factory=list)
    error: str = ""

    def text(self) -> str:
        if self.error:
            return f"{self.path}: could not verify: {self.error}"
        if self.same:
            lines = [f"{self.path}: same"]
        else:
            lines = [f"{self.path}: {len(self.differences)} difference(s)"]
            lines += [f"  - {d}" for d in self.differences]
        lines += [f"  note: {n}" for n in self.notes]
        return "\n".join(lines)


def verify(path, *, root=None, timeout: float = 600) -> VerifyReport:
    """Re-execute an archived calc and compare it with its record (see the module docstring).

    ``root`` is the archive root holding ``manifest.jsonl`` (default: three levels above ``path``,
    i.e. ``root/<date>/<member>/<file>``).
    """
    from .batch import execute_calc
    from .params import ParameterError, validate

    path = Path(path)
    rep = VerifyReport(str(path))
    if not path.is_file():
        rep.error = "no such file"
        return rep
    import nbformat

    raw = path.read_bytes()
    try:
        nb = nbformat.reads(raw.decode("utf-8"), as_version=4)
    except Exception as exc:
        rep.error = f"not a readable notebook ({exc})"
        return rep
    meta = nb.metadata.get("calckit") or {}
    calc = meta.get("calc")
    params = dict((nb.metadata.get("papermill") or {}).get("parameters") or {})
    if not calc or not params:
        rep.error = "not a calckit archive record (no calckit/papermill metadata)"
        return rep
    root = Path(root) if root is not None else path.resolve().parents[2]
    rel = path.resolve().relative_to(root.resolve()).as_posix() if _is_under(path, root) else path.name
    entry = find_entry(root, rel)
    if entry is None:
        rep.differences.append(f"no line for {rel} in {root / MANIFEST}")
    else:
        outs = entry.get("outputs") or {}
        if outs.get("ipynb", {}).get("sha256") != sha256_bytes(raw):
            rep.differences.append("notebook SHA-256 differs from the manifest: the file was changed "
                                   "after it was archived")
        html = outs.get("html")
        if html:
            hp = root / html["path"]
            if not hp.is_file():
                rep.differences.append(f"archive HTML {html['path']} is missing")
            elif sha256_file(hp) != html.get("sha256"):
                rep.differences.append("archive HTML SHA-256 differs from the manifest: the file was "
                                       "changed after it was archived")
    try:
        tpl = template_path(calc)
    except InputError as exc:
        rep.error = str(exc)
        return rep
    tsha = sha256_file(tpl)
    if meta.get("template_sha256") != tsha:
        rep.differences.append(f"template {tpl.name} has changed since the record was made "
                               f"(record {str(meta.get('template_sha256'))[:12]}, now {tsha[:12]})")
    if entry is not None and entry.get("template_sha256") not in (None, meta.get("template_sha256")):
        rep.differences.append("template SHA-256 in the notebook differs from the manifest")
    pf = meta.get("parameter_file")
    if pf and Path(pf).is_file() and sha256_file(pf) != meta.get("parameter_sha256"):
        rep.notes.append(f"parameter file {pf} has changed since the record was made (the record's own "
                         "parameters were used)")
    vers = versions()
    for lib, v in (meta.get("versions") or {}).items():
        if vers.get(lib, v) != v:
            rep.notes.append(f"{lib} was {v} when archived, now {vers.get(lib)}")
    try:
        clean = validate(calc, params, source=f"{path.name} (papermill parameters)", allow_reserved=True)
    except ParameterError as exc:
        rep.error = f"the record's parameters are not valid now:\n{exc}"
        return rep
    archived = summary_payload(nb)
    if archived is None:
        rep.differences.append("the record has no results payload")
    run = execute_calc(calc, clean, timeout=timeout, fork=False)  # a plain kernel: an independent path
    if run.error and run.payload is None:
        rep.error = f"re-execution failed: {run.error}"
        return rep
    if archived is not None and run.payload is not None:
        rep.differences += compare_payloads(archived, run.payload)
    if run.nb is not None:
        normalise(run.nb, template_name=tpl.name, output_name=nb.metadata.get("papermill", {}).get(
            "output_path", ""))
        run.nb.metadata["calckit"] = meta
        same_bytes = notebook_bytes(run.nb) == raw
        rep.notes.append("the re-executed notebook is byte-identical to the record" if same_bytes else
                         "the re-executed notebook is not byte-identical to the record (numbers compared "
                         "above)")
    rep.same = not rep.differences
    return rep


def _is_under(path: Path, root: Path) -> bool:
    try:
        path.resolve().relative_to(root.resolve())
        return True
    except ValueError:
        return False


def iter_records(root) -> Iterator[Path]:
    """Archived notebooks under ``root``, oldest date first."""
    root = Path(root)
    for day in sorted(p for p in root.iterdir() if p.is_dir()) if root.is_dir() else ():
        yield from sorted(day.glob("*/*-r*.ipynb"))
