"""``calcreport schema``: print the JSON Schema of job files (``--results``: of the results JSON)."""

from __future__ import annotations

import sys

from ..errors import EXIT_OK

__all__ = ["register"]


def _cmd_schema(args) -> int:
    from ..schema import dumps, job_schema, results_schema

    sys.stdout.write(dumps(results_schema() if args.results else job_schema()))
    return EXIT_OK


def register(sub, common) -> None:
    s = sub.add_parser(
        "schema",
        help="print the JSON Schema of job files (for editors) or of the results JSON",
        description="Print the JSON Schema of job files, generated from the same key declarations the "
        "reader validates against. Point a TOML language server at it with a first line like "
        "'#:schema ./job.schema.json' (see docs/job-format.md). With --results, print the schema of "
        "the results JSON (check --json, build --json), versioned by its 'schema' number.",
        parents=[common],
    )
    s.add_argument("--results", action="store_true", help="the schema of the results JSON instead")
    s.set_defaults(func=_cmd_schema)
