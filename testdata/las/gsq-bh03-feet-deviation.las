~VERSION INFORMATION
 VERS.                  2.0 :   CWLS LOG ASCII STANDARD - VERSION 2.0
 WRAP.                   NO :   ONE LINE PER DEPTH STEP
~WELL INFORMATION
 STRT.FT          0.0000              : START DEPTH
 STOP.FT         40.0000              : STOP DEPTH
 STEP.FT          5.0000              : STEP
 NULL.           -999.25              : NULL VALUE
 COMP.           GREYSCAR QUARRY LTD  : COMPANY
 WELL.           GSQ-BH03             : WELL
 DATE.           2024-04-02           : LOG DATE
~CURVE INFORMATION
 DEPT.FT                              : DEPTH
 AZI .DEG                             : HOLE AZIMUTH, MAGNETIC
 DEVI.DEG                             : HOLE INCLINATION FROM VERTICAL
 GR  .GAPI                            : NATURAL GAMMA
~PARAMETER INFORMATION
 BS  .MM          96.0                : BIT SIZE
~A
 0.0   355.0   30.0   -999.25
 5.0   356.2   30.1     40.5
10.0   357.5   30.3     42.0
15.0   358.8   30.4     43.8
20.0     0.4   30.6     45.1
25.0     1.5   30.9     44.7
30.0     2.9   31.2     46.2
35.0     4.0   31.4     47.9
40.0     5.6   31.7     48.3
