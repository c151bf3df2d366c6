"""The sub-commands of ``calcreport`` beyond check and new: build (with batches) and the review commands (diff, verify).

Each module has ``register(sub)``; :mod:`calcreport.cli` registers them all in one place."""
