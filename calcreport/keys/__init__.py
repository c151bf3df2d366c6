"""Declarations of job-file keys that both the reader (:mod:`calcreport.jobfile`) and the solver
use, so the reader never imports the solver: connector fields, standard load cases."""
