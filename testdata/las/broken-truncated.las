~VERSION INFORMATION
 VERS.                  2.0 :   CWLS LOG ASCII STANDARD - VERSION 2.0
 WRAP.                   NO :   ONE LINE PER DEPTH STEP
~WELL INFORMATION
 STRT.M          10.0000              : START DEPTH
 STOP.M          11.0000              : STOP DEPTH
 STEP.M          0.2500               : STEP
 NULL.           -999.25              : NULL VALUE
 WELL.           GSQ-BH07             : WELL
~CURVE INFORMATION
 DEPT.M                               : DEPTH
 GR  .GAPI                            : NATURAL GAMMA
 DEN .G/CC                            : BULK DENSITY
~A
10.00    45.20    2.650
10.25    47.85    2.655
10.50    49.10    2.661
10.75    52.1