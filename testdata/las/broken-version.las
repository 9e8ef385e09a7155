~VERSION INFORMATION
 VERS.                  4.2 :   LOG ASCII STANDARD - NOT A CWLS VERSION
 WRAP.                   NO :   ONE LINE PER DEPTH STEP
~WELL INFORMATION
 STRT.M          10.0000              : START DEPTH
 STOP.M          10.2500              : STOP DEPTH
 STEP.M          0.2500               : STEP
 NULL.           -999.25              : NULL VALUE
 WELL.           GSQ-BH07             : WELL
~CURVE INFORMATION
 DEPT.M                               : DEPTH
 GR  .GAPI                            : NATURAL GAMMA
~A
10.00    45.20
10.25    47.85
