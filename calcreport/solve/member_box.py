"""placeholder"""
def box_checks(member, section, beam, V, settings, log):
    return [], []
