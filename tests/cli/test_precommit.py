"""The pre-commit hook for real: a scratch git repository, two migrations, this checkout as the hook.

The hook repository is a snapshot of this working tree (tracked and untracked, not ignored files)
committed into a scratch repository, so the test runs the code as it is on disk. pre-commit installs
it into an isolated environment (``pip install`` through the machine's package index) and runs
``normguard check`` on the staged ``.sql`` files. The facts relied
on come from pre-commit's documentation and source (FORMATS.md §4: ``try-repo`` uses the hook
repository's HEAD plus its uncommitted tracked edits; without ``--files`` only staged files are
checked; ``types: [sql]`` matches the ``.sql`` extension).
"""
from __future__ import annotations

import os
import shutil
import subprocess
import sys
from pathlib import Path

import pytest

from ..locations import ROOT

SETTINGS = "paths: [db]\nmigrations: db\ndialect: postgres\n"
DEPOTS = """CREATE TABLE depots (
    depot_id integer PRIMARY KEY,
    city     text NOT NULL
);
"""
SCANS = """-- scanner feed, not staged again: its missing key must not be reported by the hook
CREATE TABLE scans (parcel_ref text NOT NULL, scanned_at timestamptz NOT NULL);
"""
DISPATCH = """-- normguard: fd dispatcher -> zone
CREATE TABLE zone_dispatch (
    courier_id  integer NOT NULL,
    zone        text NOT NULL,
    dispatcher  text NOT NULL,
    PRIMARY KEY (courier_id, zone)
);
"""
RIDERS = """-- clean: every column depends on the key
CREATE TABLE riders (
    rider_id  integer PRIMARY KEY,
    depot_id  integer NOT NULL REFERENCES depots (depot_id),
    name      text NOT NULL
);
"""


def _tool(name: str) -> str:
    """``name`` beside this interpreter or on PATH; skip the test when it is missing."""
    beside = Path(sys.executable).with_name(name)
    found = str(beside) if beside.exists() else shutil.which(name)
    if found is None:
        pytest.skip(f"{name} is not installed; the pre-commit hook test needs it")
    return found


@pytest.fixture(scope="module")
def tools() -> tuple[str, str]:
    """git and pre-commit."""
    return _tool("git"), _tool("pre-commit")


@pytest.fixture(scope="module")
def hook_repo(tools: tuple[str, str], env: dict[str, str], tmp_path_factory: pytest.TempPathFactory) -> Path:
    """This working tree as it is on disk, committed into a scratch repository (the hook's source)."""
    git = tools[0]
    listing = ["ls-files", "-z", "--cached", "--others", "--exclude-standard"]
    listed = subprocess.run([git, "-C", str(ROOT), *listing], capture_output=True, text=True)
    if listed.returncode != 0:
        pytest.skip("this checkout is not a git repository, so its files cannot be listed for the hook")
    snapshot = tmp_path_factory.mktemp("hook-repo")
    for name in filter(None, listed.stdout.split("\0")):
        source = ROOT / name
        if source.is_file():
            (snapshot / name).parent.mkdir(parents=True, exist_ok=True)
            shutil.copy2(source, snapshot / name)
    for command in (["init", "-q"], ["add", "-A"], ["commit", "-q", "--no-verify", "-m", "snapshot"]):
        subprocess.run([git, *command], cwd=snapshot, env=env, check=True, capture_output=True)
    return snapshot


@pytest.fixture(scope="module")
def env(tmp_path_factory: pytest.TempPathFactory) -> dict[str, str]:
    """A private PRE_COMMIT_HOME (environments are built once per module), no colour, a git identity."""
    values = {k: v for k, v in os.environ.items() if not k.startswith("GIT_") and k != "NO_COLOR"}
    values.update(
        PRE_COMMIT_HOME=str(tmp_path_factory.mktemp("pre-commit-home")),
        PRE_COMMIT_COLOR="never",
        GIT_AUTHOR_NAME="Courier Dev", GIT_AUTHOR_EMAIL="dev@courier.invalid",
        GIT_COMMITTER_NAME="Courier Dev", GIT_COMMITTER_EMAIL="dev@courier.invalid",
    )
    return values


@pytest.fixture
def repo(tmp_path: Path, tools: tuple[str, str], env: dict[str, str], hook_repo: Path) -> Path:
    """A git repository with settings, two committed migrations and a pre-commit config."""
    git = tools[0]
    (tmp_path / "db").mkdir()
    (tmp_path / ".normguard.yaml").write_text(SETTINGS, encoding="utf-8")
    (tmp_path / "db" / "001_depots.sql").write_text(DEPOTS, encoding="utf-8")
    (tmp_path / "db" / "002_scans.sql").write_text(SCANS, encoding="utf-8")
    head = subprocess.run([git, "-C", str(hook_repo), "rev-parse", "HEAD"],
                          capture_output=True, text=True, check=True)
    config = (f"repos:\n-   repo: {hook_repo.as_posix()}\n    rev: {head.stdout.strip()}\n"
              "    hooks:\n    -   id: normguard\n")
    (tmp_path / ".pre-commit-config.yaml").write_text(config, encoding="utf-8")
    for command in (["init", "-q"], ["add", "."], ["commit", "-q", "--no-verify", "-m", "depots and scans"]):
        subprocess.run([git, *command], cwd=tmp_path, env=env, check=True, capture_output=True)
    return tmp_path


def _stage_and_try(repo: Path, tools: tuple[str, str], env: dict[str, str], hook: Path, name: str, text: str):
    """Stage one new migration and run the hook with ``try-repo`` on the staged files."""
    git, pre_commit = tools
    (repo / "db" / name).write_text(text, encoding="utf-8")
    subprocess.run([git, "add", f"db/{name}"], cwd=repo, env=env, check=True)
    return subprocess.run([pre_commit, "try-repo", str(hook), "normguard", "--verbose"],
                          cwd=repo, env=env, capture_output=True, text=True, timeout=1200)


def test_a_migration_breaking_bcnf_is_blocked(repo, tools, env, hook_repo):
    done = _stage_and_try(repo, tools, env, hook_repo, "003_dispatch.sql", DISPATCH)
    output = done.stdout + done.stderr
    assert done.returncode == 1, output
    assert "db/003_dispatch.sql:1:4: warning: dispatcher -> zone" in output
    assert "[bcnf-violation]" in output
    assert "002_scans.sql" not in output  # replayed for context, not reported: it is not staged


def test_a_clean_migration_passes(repo, tools, env, hook_repo):
    done = _stage_and_try(repo, tools, env, hook_repo, "003_riders.sql", RIDERS)
    output = done.stdout + done.stderr
    assert done.returncode == 0, output
    assert "normguard: 0 errors, 0 warnings, 0 notes" in output


def test_git_commit_runs_the_installed_hook(repo, tools, env):
    """The hook installed as the repository's git hook, from the config's repo and rev."""
    git, pre_commit = tools
    subprocess.run([pre_commit, "install"], cwd=repo, env=env, check=True, capture_output=True)

    def commit(name: str, text: str) -> subprocess.CompletedProcess[str]:
        (repo / "db" / name).write_text(text, encoding="utf-8")
        subprocess.run([git, "add", f"db/{name}"], cwd=repo, env=env, check=True)
        return subprocess.run([git, "commit", "-m", f"add {name}"], cwd=repo, env=env,
                              capture_output=True, text=True, timeout=1200)

    blocked = commit("003_dispatch.sql", DISPATCH)
    assert blocked.returncode != 0
    assert "[bcnf-violation]" in blocked.stdout + blocked.stderr
    subprocess.run([git, "rm", "-q", "--cached", "db/003_dispatch.sql"], cwd=repo, env=env, check=True)
    (repo / "db" / "003_dispatch.sql").unlink()
    passed = commit("003_riders.sql", RIDERS)
    assert passed.returncode == 0, passed.stdout + passed.stderr
    log = subprocess.run([git, "log", "--format=%s", "-1"], cwd=repo, env=env, capture_output=True, text=True)
    assert log.stdout.strip() == "add 003_riders.sql"
