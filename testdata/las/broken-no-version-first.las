~WELL INFORMATION
 STRT.M          10.0000              : START DEPTH
 STOP.M          10.2500              : STOP DEPTH
 STEP.M          0.2500               : STEP
 NULL.           -999.25              : NULL VALUE
 WELL.           GSQ-BH07             : WELL
~VERSION INFORMATION
 VERS.                  2.0 :   CWLS LOG ASCII STANDARD - VERSION 2.0
 WRAP.                   NO :   ONE LINE PER DEPTH STEP
~CURVE INFORMATION
 DEPT.M                               : DEPTH
 GR  .GAPI                            : NATURAL GAMMA
~A
10.00    45.20
10.25    47.85
