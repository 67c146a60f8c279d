#!/usr/bin/python3
"""Replay a fleet of field logs with Dask distributed: one `heatledger fleet` run per partition of
the logs, mapped over a cluster of worker processes, then one `heatledger fleet merge` of the
partition outputs. The merged summary is the one a single `heatledger fleet` run over all the logs
prints, bit for bit: every unit's row depends only on its own log, and the merge ranks the rows by
a total order.

Usage (from the repository root, after `npm ci`):
  /usr/bin/python3 examples/fleet-dask/run_fleet.py profiles/irrigation-pump-decade.yaml \
      profiles/logs/fleet-irrigation --partitions 3 --out fleet.ndjson

See README.md beside this file.
"""

import argparse
import os
import shutil
import subprocess
import sys
import tempfile

# The repository root, two folders up; its bin/heatledger.js is the CLI the partitions run.
ROOT = os.path.normpath(os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", ".."))


def node_command():
    """The node executable and the heatledger launcher (HEATLEDGER_NODE overrides the node found on PATH)."""
    node = os.environ.get("HEATLEDGER_NODE") or shutil.which("node")
    if node is None:
        sys.exit("run_fleet.py: node (Node.js 20 or later) is not on PATH; set HEATLEDGER_NODE")
    return [node, os.path.join(ROOT, "bin", "heatledger.js")]


def list_logs(args):
    """The logs as `heatledger fleet` lists them: a folder gives its .csv files in every subfolder
    (names starting with a dot skipped), sorted by name; a file is taken as given."""
    logs = []
    for arg in args:
        if os.path.isdir(arg):
            found = []
            for folder, subfolders, files in os.walk(arg):
                subfolders[:] = [d for d in subfolders if not d.startswith(".")]
                found += [os.path.join(folder, f) for f in files if f.lower().endswith(".csv") and not f.startswith(".")]
            # the CLI walks each folder in name order, files and subfolders together
            logs += sorted(found, key=lambda p: os.path.relpath(p, arg).split(os.sep))
        else:
            logs.append(arg)
    return logs


def replay_partition(task):
    """Run on a Dask worker: `heatledger fleet PROFILE LOGS... --ndjson OUT` in one thread.
    Exit status 0, 1 (a unit fails) and 2 (a log could not be replayed: its row says why) all
    leave a complete partition; anything else is an error of the run itself."""
    command, cwd, profile, logs, out = task
    run = subprocess.run(command + ["fleet", profile, *logs, "--ndjson", out, "--force", "--workers", "1"], cwd=cwd, capture_output=True, text=True)
    if run.returncode not in (0, 1, 2) or not os.path.exists(out):
        raise RuntimeError(f"heatledger fleet failed on a partition (exit {run.returncode}): {run.stderr.strip()}")
    return out


def main():
    parser = argparse.ArgumentParser(description="Replay a fleet of field logs over a Dask cluster, then merge.")
    parser.add_argument("profile", help="duty profile (YAML or JSON)")
    parser.add_argument("logs", nargs="+", help="event logs or folders of logs")
    parser.add_argument("--partitions", type=int, default=4, help="number of partitions (default 4)")
    parser.add_argument("--out", required=True, help="the merged summary (NDJSON), as `heatledger fleet --ndjson FILE` writes it")
    parser.add_argument("--workers", type=int, default=2, help="Dask worker processes (default 2)")
    options = parser.parse_args()

    from dask.distributed import Client, LocalCluster

    command = node_command()
    logs = list_logs(options.logs)
    count = max(1, min(options.partitions, len(logs)))
    # contiguous shares of the list; any split gives the same merged summary
    shares = [logs[len(logs) * k // count : len(logs) * (k + 1) // count] for k in range(count)]
    with tempfile.TemporaryDirectory(prefix="heatledger-fleet-") as scratch:
        tasks = [(command, os.getcwd(), options.profile, share, os.path.join(scratch, f"part-{k}.ndjson")) for k, share in enumerate(shares)]
        with LocalCluster(n_workers=options.workers, processes=True, threads_per_worker=1, dashboard_address=None) as cluster, Client(cluster) as client:
            parts = client.gather(client.map(replay_partition, tasks))
        merged = subprocess.run(command + ["fleet", "merge", *parts, "--ndjson", options.out, "--force"])
    return merged.returncode


if __name__ == "__main__":
    sys.exit(main())
