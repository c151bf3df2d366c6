"""Review workflow: diff of two revisions, change report, verify a PDF against its job file."""
